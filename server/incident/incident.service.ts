import { createHash } from 'node:crypto';
import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { IncidentBody } from '../../shared/schemas/register.js';
import { forbidden, unprocessable } from '../errors.js';
import { findPerson } from '../authorisations/facts.repository.js';
import { findUserById } from '../people/people.repository.js';
import { findSite } from '../sites/sites.repository.js';
import { fileContents } from '../register/evidence.repository.js';
import { makeRowEvidence } from '../register/register.evidence.js';
import { resolveMoment } from '../register/moment.js';
import { gatherPack } from './incident.gather.js';
import { renderIncidentPdf } from './incident.pdf.js';
import { buildIncidentZip } from './incident.zip.js';

const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

/** Freezes what stood at a moment for a person (and a bench) into one PDF, with the files beside it in a ZIP. */
export function makeIncidentService(deps: Deps) {
  const { db, clock, audit } = deps;
  const rows = makeRowEvidence(deps);

  async function pack(actor: Actor, ability: AppAbility, body: IncidentBody) {
    const m = resolveMoment({ at: body.at, view: 'effective' }, clock.now());
    const person = await findPerson(db, body.personId);
    if (!person) throw unprocessable('personId: no such person', { personId: 'no such person' });
    if (!ability.can('read', subjectOf('Register', { siteId: person.siteId, personId: person.id }))) throw forbidden('You may not make a pack about this person.');
    // A moment before the account is answered too: the register holds paper-recorded facts for it, and the pack says they were recorded later.
    const parts = await gatherPack(deps, rows, ability, person, m.at, body.benchId);
    if (parts.bench && !ability.can('read', subjectOf('Bench', { siteId: parts.bench.siteId }))) throw forbidden('You may not see that bench.');
    const [me, site] = await Promise.all([findUserById(db, actor.id), findSite(db, person.siteId)]);
    const full = { ...parts, producedAt: clock.now(), producedBy: me?.name ?? actor.id, note: body.note, person: { id: person.id, name: person.name, email: person.email, siteCode: site?.code ?? '', siteName: person.siteName, timeZone: person.timeZone } };
    const pdf = await renderIncidentPdf(full);
    const zip = await buildIncidentZip(full, pdf, await fileContents(db, full.files.map((f) => f.id)));
    await db.transaction((tx) => audit(tx, {
      actorId: actor.id, action: 'incident_pack.exported', entity: 'user', entityId: person.id,
      newValues: { at: m.at.toISOString(), benchId: body.benchId ?? null, note: body.note, pdfSha256: sha(pdf), zipSha256: sha(zip), files: full.files.length },
    }));
    return { zip, fileName: `incident-pack-${person.name.replace(/[^A-Za-z0-9]+/g, '-')}-${m.at.toISOString().replace(/[:.]/g, '')}.zip` };
  }

  return { pack };
}
