import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { instrumentRatingProblems, type InstrumentBody, type InstrumentsQuery, type InstrumentUpdateBody } from '../../shared/schemas/instruments.js';
import { DUE_SOON_DAYS } from '../../shared/equipment.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { conflict, forbidden, notFound, unprocessable } from '../errors.js';
import { countSites } from '../sites/sites.repository.js';
import * as repo from './instruments.repository.js';
import { presentInstrument } from './equipment.present.js';
import type { Usability } from './usability.service.js';

const duplicate = () => conflict('serial: this make and model with this serial number is already recorded', { serial: 'already recorded for this make and model' });

export function makeInstrumentsService(deps: Deps, usability: Usability) {
  const { db, clock, audit } = deps;

  async function load(ability: AppAbility, id: string, action: 'read' | 'update' = 'read') {
    const view = await repo.findInstrument(db, id);
    if (!view) throw notFound('That instrument');
    if (!ability.can(action, subjectOf('Instrument', view.instrument))) throw forbidden(action === 'read' ? 'You may not see this instrument.' : 'You may not change instruments at this site.');
    return view;
  }

  async function checkSite(ability: AppAbility, action: 'create' | 'update', siteId: string) {
    if (!ability.can(action, subjectOf('Instrument', { siteId }))) throw forbidden('You may not keep instruments at that site.');
    if ((await countSites(db, [siteId])) !== 1) throw unprocessable('siteId: no such site', { siteId: 'no such site' });
  }

  async function list(ability: AppAbility, q: InstrumentsQuery) {
    const access = accessibleWhere(ability, 'read', 'Instrument', repo.instrumentAccessColumns);
    const now = clock.now();
    const active = q.active === undefined ? undefined : q.active === 'true';
    const { items, total } = await repo.listInstruments(db, { ...q, active, access, now, dueSoonDays: DUE_SOON_DAYS });
    return { items: items.map((v) => presentInstrument(v, now)), total, page: q.page, pageSize: q.pageSize };
  }

  async function create(actor: Actor, ability: AppAbility, body: InstrumentBody) {
    await checkSite(ability, 'create', body.siteId);
    if (await repo.findInstrumentByIdentity(db, body.make, body.model, body.serial)) throw duplicate();
    const now = clock.now();
    const created = await db.transaction(async (tx) => {
      const i = await repo.insertInstrument(tx, { ...body, createdAt: now, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'instrument.created', entity: 'instrument', entityId: i.id, newValues: body });
      return i;
    });
    return presentInstrument((await repo.findInstrument(db, created.id))!, now);
  }

  async function update(actor: Actor, ability: AppAbility, id: string, body: InstrumentUpdateBody) {
    const before = await load(ability, id, 'update');
    const merged = { ...before.instrument, ...body };
    const problems = instrumentRatingProblems(merged);
    if (Object.keys(problems).length) throw unprocessable(Object.entries(problems).map(([k, v]) => `${k}: ${v}`).join('; '), problems);
    if (body.siteId && body.siteId !== before.instrument.siteId) await checkSite(ability, 'update', body.siteId);
    const b = before.instrument;
    if ((merged.make !== b.make || merged.model !== b.model || merged.serial !== b.serial) && (await repo.findInstrumentByIdentity(db, merged.make, merged.model, merged.serial))) throw duplicate();
    const now = clock.now();
    const old = Object.fromEntries(Object.keys(body).map((k) => [k, b[k as keyof typeof b]]));
    await db.transaction(async (tx) => {
      await repo.lockInstrument(tx, id);
      await repo.updateInstrument(tx, id, { ...body, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'instrument.updated', entity: 'instrument', entityId: id, oldValues: old, newValues: body });
    });
    return presentInstrument((await repo.findInstrument(db, id))!, now);
  }

  async function usabilityOf(ability: AppAbility, id: string, circuitVoltage?: number) {
    await load(ability, id);
    return usability.checkInstrumentUsable(id, clock.now(), circuitVoltage);
  }

  return { list, get: async (ability: AppAbility, id: string) => presentInstrument(await load(ability, id), clock.now()), create, update, usabilityOf };
}
