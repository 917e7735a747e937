import type { Deps } from '../deps.js';
import type { Executor } from '../db/client.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { COMPLETED_MEANING, COUNTERSIGNED_MEANING } from '../../shared/schemas/signoffs.js';
import { conflict, forbidden, notFound, unprocessable } from '../errors.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { insertCheck } from '../benches/benches.repository.js';
import { PRE_USE_CHECK_MEANING } from '../benches/benches.service.js';
import { reevaluatePerson } from '../authorisations/index.js';
import { failingItems } from '../records/items.present.js';
import * as repo from './signoffs.repository.js';
import { editableSignoff } from './signoffs.access.js';
import { signoffView } from './signoffs.views.js';

export function makeSignoffSigning(deps: Deps, signatures: Signatures) {
  const { db, clock, audit } = deps;
  const view = async (id: string) => signoffView(db, signatures, (await repo.findSignoff(db, id))!);

  /** Checked before the password is: every item complete and within its rule, each failing one named. */
  async function submit(actor: Actor, ability: AppAbility, id: string, body: { password: string; recordAsFailed: boolean }) {
    const row = await editableSignoff(db, ability, id);
    const { items } = await signoffView(db, signatures, row);
    const failed = items.filter((i) => i.entry?.verdict === 'fail');
    const missing = failingItems(items.filter((i) => i.problem && i.entry?.verdict !== 'fail'));
    const bench = row.kind === 'bench-pre-use';
    if (Object.keys(missing).length || (failed.length && !bench)) {
      const fields = failingItems(items);
      throw unprocessable(`${Object.keys(fields).length} item(s) stop this sign-off: ${Object.values(fields).join('; ')}`, fields);
    }
    if (failed.length && !body.recordAsFailed) {
      const fields = { ...failingItems(failed), recordAsFailed: 'confirm to record this as a failed pre-use check' };
      throw unprocessable(`These readings fail: ${Object.values(failingItems(failed)).join('; ')}. Confirm to record a failed check; the bench is then refused until a check passes.`, fields);
    }
    const signer = await signatures.verify(actor.id, body.password);
    const now = clock.now();
    await db.transaction(async (tx) => {
      const locked = await editableSignoff(tx, ability, id, true);
      const signature = await signatures.record(tx, signer, { meaning: COMPLETED_MEANING, entity: 'signoff', entityId: id });
      let patch: Partial<repo.SignoffInsert> = { status: 'submitted' };
      if (bench) {
        const benchRow = await repo.benchBrief(tx, locked.benchId!);
        const notes = failed.length ? failed.map((i) => `${i.prompt}: ${i.entry?.ruleText ?? 'outside its rule'}`).join('; ') : null;
        const check = await insertCheck(tx, { benchId: benchRow!.id, personId: actor.id, at: now, passed: !failed.length, notes, checklistResponseId: id });
        await signatures.record(tx, signer, { meaning: PRE_USE_CHECK_MEANING, entity: 'bench_check', entityId: check.id });
        await audit(tx, { actorId: actor.id, action: 'bench.pre_use_check', entity: 'bench_check', entityId: check.id, newValues: { benchId: check.benchId, passed: check.passed, notes, signoffId: id } });
        patch = { status: 'recorded', passed: check.passed, notes, benchCheckId: check.id };
      }
      await repo.updateSignoff(tx, id, { ...patch, submittedAt: now, submitSignatureId: signature.id, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'signoff.submitted', entity: 'signoff', entityId: id, oldValues: { status: 'in_progress' }, newValues: { ...patch, signatureId: signature.id } });
      // A signed correction replaces the sign-off it corrects: what rested on that one is decided again.
      if (locked.correctsId) await reevaluatePerson(tx, locked.personId, { clock, audit, actorId: actor.id });
    });
    return view(id);
  }

  /** Who may review: an assessor covering the site, never the person it is about. */
  async function reviewable(tx: Executor, actor: Actor, ability: AppAbility, id: string, lock = false) {
    const row = await repo.findSignoff(tx, id, lock);
    if (!row) throw notFound('That sign-off');
    if (row.personId === actor.id) throw forbidden('Nobody countersigns or returns their own sign-off.');
    if (!ability.can('approve', subjectOf('Signoff', row))) throw forbidden('Only an assessor covering that site countersigns its sign-offs.');
    if (row.kind !== 'self-sign-off') throw conflict('A bench pre-use check is complete once signed; it is not countersigned.');
    if (row.status !== 'submitted') throw conflict(`This sign-off is ${row.status.replace('_', ' ')}, not waiting for a countersignature.`, { status: row.status });
    return row;
  }

  async function countersign(actor: Actor, ability: AppAbility, id: string, password: string) {
    const row = await reviewable(db, actor, ability, id);
    const signer = await signatures.verify(actor.id, password);
    const now = clock.now();
    await db.transaction(async (tx) => {
      await reviewable(tx, actor, ability, id, true);
      const signature = await signatures.record(tx, signer, { meaning: COUNTERSIGNED_MEANING, entity: 'signoff', entityId: id });
      await repo.updateSignoff(tx, id, { status: 'countersigned', reviewedBy: actor.id, reviewedAt: now, reviewSignatureId: signature.id, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'signoff.countersigned', entity: 'signoff', entityId: id, oldValues: { status: 'submitted' }, newValues: { status: 'countersigned', signatureId: signature.id } });
      // The completing event: authorisations that rest on this sign-off are issued in this transaction.
      await reevaluatePerson(tx, row.personId, { clock, audit, actorId: actor.id });
    });
    return view(id);
  }

  async function returnIt(actor: Actor, ability: AppAbility, id: string, comment: string) {
    const row = await reviewable(db, actor, ability, id);
    const now = clock.now();
    await db.transaction(async (tx) => {
      await reviewable(tx, actor, ability, id, true);
      await repo.updateSignoff(tx, id, { status: 'returned', reviewedBy: actor.id, reviewedAt: now, returnComment: comment, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'signoff.returned', entity: 'signoff', entityId: id, oldValues: { status: 'submitted' }, newValues: { status: 'returned', comment } });
      if (row.correctsId) await reevaluatePerson(tx, row.personId, { clock, audit, actorId: actor.id });
    });
    return view(id);
  }

  return { submit, countersign, returnIt };
}
export type SignoffSigning = ReturnType<typeof makeSignoffSigning>;
