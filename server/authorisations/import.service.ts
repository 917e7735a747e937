import { randomUUID } from 'node:crypto';
import type { Deps } from '../deps.js';
import type { Actor, AppAbility } from '../../shared/abilities.js';
import { PRIOR_MEANING } from '../../shared/authorisations/kinds.js';
import type { ImportBody } from '../../shared/schemas/authorisations.js';
import type { ImportReport } from '../../shared/authorisations/views.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { AppError, unprocessable } from '../errors.js';
import { insertUser, replaceRoles } from '../people/people.repository.js';
import { lockPerson, type PersonRow } from './facts.repository.js';
import { reevaluatePerson } from './issuing.js';
import { writePrior } from './prior.js';
import { parseImport } from './import.parse.js';
import { checkImport, type PlannedRow } from './import.check.js';
import { Writer } from './writer.js';

const report = (dryRun: boolean, planned: PlannedRow[], written: ImportReport['written']): ImportReport => ({
  dryRun, ok: planned.every((p) => !p.problems.length), written,
  rows: planned.map((p) => ({ line: p.row.line, email: p.row.email, scope: p.row.scope, problems: p.problems })),
});

/**
 * People and their paper authorisations from a CSV file. The dry run lists every row's problems; the
 * real run checks again and writes every row in one transaction, or none of them.
 */
export function makeImportService(deps: Deps, signatures: Signatures) {
  const { db, clock, audit } = deps;

  async function run(actor: Actor, ability: AppAbility, body: ImportBody): Promise<ImportReport> {
    const rows = parseImport(body.csv);
    const planned = await checkImport(db, actor, ability, rows, clock.now());
    if (body.dryRun) return report(true, planned, null);
    const bad = planned.filter((p) => p.problems.length);
    if (bad.length) {
      const fields = Object.fromEntries(bad.map((p) => [`line ${p.row.line}`, p.problems.join('; ')]));
      throw new AppError(422, 'import_refused', `Nothing was written: ${bad.length} row(s) have problems, the first on line ${bad[0].row.line} (${bad[0].problems[0]}).`, fields);
    }
    if (!body.password) throw unprocessable('password: re-enter your password to sign the import', { password: 're-enter your password to sign the import' });
    const signer = await signatures.verify(actor.id, body.password);
    const batchId = randomUUID();
    const written = await db.transaction(async (tx) => {
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
      for (const p of planned.filter((x) => x.scope)) {
        const holder = holders.get((p.holder ?? created.get(p.row.email)!).id)!;
        await writePrior(tx, w, holder, p.scope!, {
          issuedOn: p.row.issued_on, expiresOn: p.row.expires_on, attestedBy: p.row.attested_by, evidenceId: null, note: p.row.note,
          origin: 'imported', signatureId: sig.id, periodId: randomUUID(),
        });
      }
      for (const id of [...holders.keys()].sort()) await reevaluatePerson(tx, id, { ...deps, actorId: actor.id });
      await audit(tx, { actorId: actor.id, action: 'authorisation.imported', entity: 'authorisation_import', entityId: batchId, newValues: { rows: planned.length, people: created.size, authorisations: planned.filter((x) => x.scope).length, signatureId: sig.id } });
      return { people: created.size, authorisations: planned.filter((x) => x.scope).length };
    });
    return report(false, planned, written);
  }

  return { run };
}
