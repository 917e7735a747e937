import { randomUUID } from 'node:crypto';
import type { Deps } from '../deps.js';
import type { Actor } from '../../shared/abilities.js';
import { PRIOR_MEANING } from '../../shared/authorisations/kinds.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { insertUser, replaceRoles } from '../people/people.repository.js';
import { lockPerson, type PersonRow } from './facts.repository.js';
import { reevaluatePerson } from './issuing.js';
import { writePrior } from './prior.js';
import type { PlannedRow } from './import.check.js';
import { Writer } from './writer.js';

export type Signer = { signerId: string; printedName: string };

/**
 * Writes checked rows in one transaction, or none of them: new people, their paper authorisations under
 * one signature, then each holder decided again. `onRow` hears of each row written (a job's progress).
 */
export async function writeImport(deps: Deps, signatures: Signatures, actor: Actor, planned: PlannedRow[], signer: Signer, onRow: () => void = () => undefined) {
  const { db, clock, audit } = deps;
  const batchId = randomUUID();
  return db.transaction(async (tx) => {
    const now = clock.now();
    const w = new Writer(tx, { ...deps, actorId: actor.id }, now);
    const sig = await signatures.record(tx, signer, { meaning: PRIOR_MEANING, entity: 'authorisation_import', entityId: batchId });
    const created = new Map<string, PersonRow>();
    for (const p of planned.filter((x) => x.newPerson)) {
      const n = p.newPerson!;
      if (created.has(n.email)) continue;
      const user = await insertUser(tx, { email: n.email, name: n.name, siteId: n.siteId, active: true, createdAt: now, updatedAt: now });
      await replaceRoles(tx, user.id, n.roles);
      await audit(tx, { actorId: actor.id, action: 'person.imported', entity: 'user', entityId: user.id, newValues: { ...n, batchId } });
      created.set(n.email, { id: user.id, name: n.name, email: n.email, active: true, siteId: n.siteId, siteName: '', timeZone: n.timeZone });
    }
    const holders = new Map<string, PersonRow>();
    for (const p of planned) {
      const holder = p.holder ?? created.get(p.row.email)!;
      holders.set(holder.id, holder);
    }
    // Locks in one order, so two imports touching the same people cannot deadlock.
    for (const id of [...holders.keys()].sort()) await lockPerson(tx, id);
    for (const p of planned) {
      if (p.scope) {
        const holder = holders.get((p.holder ?? created.get(p.row.email)!).id)!;
        await writePrior(tx, w, holder, p.scope, {
          issuedOn: p.row.issued_on, expiresOn: p.row.expires_on, attestedBy: p.row.attested_by, evidenceId: null, note: p.row.note,
          origin: 'imported', signatureId: sig.id, periodId: randomUUID(),
        });
      }
      onRow();
    }
    for (const id of [...holders.keys()].sort()) await reevaluatePerson(tx, id, { ...deps, actorId: actor.id });
    await audit(tx, { actorId: actor.id, action: 'authorisation.imported', entity: 'authorisation_import', entityId: batchId, newValues: { rows: planned.length, people: created.size, authorisations: planned.filter((x) => x.scope).length, signatureId: sig.id } });
    return { people: created.size, authorisations: planned.filter((x) => x.scope).length };
  });
}
