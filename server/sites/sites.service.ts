import type { Deps } from '../deps.js';
import type { Actor } from '../../shared/abilities.js';
import type { SiteBody } from '../../shared/schemas/sites.js';
import { conflict, notFound } from '../errors.js';
import * as repo from './sites.repository.js';

export function makeSitesService({ db, clock, audit }: Deps) {
  const present = (s: repo.SiteRow) => ({ id: s.id, code: s.code, name: s.name, timeZone: s.timeZone, personTerm: s.personTerm });

  async function create(actor: Actor, body: SiteBody) {
    const existing = (await repo.listSites(db)).find((s) => s.code === body.code);
    if (existing) throw conflict('code: a site with this code exists', { code: 'already in use' });
    const site = await db.transaction(async (tx) => {
      const s = await repo.insertSite(tx, { ...body, createdAt: clock.now() });
      await audit(tx, { actorId: actor.id, action: 'site.created', entity: 'site', entityId: s.id, newValues: body });
      return s;
    });
    return present(site);
  }

  async function update(actor: Actor, id: string, body: Partial<SiteBody>) {
    const before = await repo.findSite(db, id);
    if (!before) throw notFound('That site');
    const site = await db.transaction(async (tx) => {
      const s = await repo.updateSite(tx, id, body);
      await audit(tx, { actorId: actor.id, action: 'site.updated', entity: 'site', entityId: id, oldValues: present(before), newValues: body });
      return s;
    });
    return present(site);
  }

  return { list: async () => (await repo.listSites(db)).map(present), create, update };
}
