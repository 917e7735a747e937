import type { Deps } from '../deps.js';
import type { Actor, AppAbility } from '../../shared/abilities.js';
import type { EntryBody } from '../../shared/schemas/signoffs.js';
import type { Expectations } from '../../shared/practicals/expectations.js';
import { conflict, notFound } from '../errors.js';
import type { Signatures } from '../signatures/signatures.service.js';
import type { Usability } from '../benches/usability.service.js';
import { checklistOf, holdPointsOf } from '../records/checklist.js';
import { buildEntry } from '../records/entry.js';
import * as repo from './practicals.repository.js';
import { recordablePractical } from './practicals.access.js';
import { refuseUnlessStepOpen } from './practicals.order.js';
import { keepAttempt } from './attempts.js';
import { practicalView } from './practicals.views.js';

/** What the assessor records at the bench, each entry saved as it is made. */
export function makePracticalRecording(deps: Deps, signatures: Signatures, usability: Usability) {
  const { db, clock, audit } = deps;
  const view = async (id: string) => practicalView(db, signatures, (await repo.findPractical(db, id))!);

  async function saveEntry(actor: Actor, ability: AppAbility, id: string, itemId: string, body: EntryBody) {
    const p = await recordablePractical(db, ability, id);
    const item = (await checklistOf(db, p.versionId, p.checklistId)).items.find((i) => i.id === itemId);
    if (!item) throw notFound('That checklist item');
    const bench = await repo.benchOf(db, p.benchId);
    const now = clock.now();
    // A correction re-records a practical that took place earlier: its instruments are judged as they stood then.
    const at = p.correctsId ? p.heldAt : now;
    const fields = await buildEntry({
      db, usability, item, body, record: { entity: 'practical', id, siteId: p.siteId },
      quantities: (p.expectations as Expectations).quantities, circuitVoltage: bench!.supplyVoltage, assessing: true, at, actorId: actor.id,
    });
    await db.transaction(async (tx) => {
      const locked = await recordablePractical(tx, ability, id, true);
      await refuseUnlessStepOpen(tx, id, p.versionId, item.stepKey);
      const seq = await repo.nextSeq(tx, id);
      if (fields.kind === 'measurement') await keepAttempt(tx, { id, itemId, seq, fields, reason: body.reason ?? null, now, actorId: actor.id });
      await repo.saveEntry(tx, id, itemId, { ...fields, recordedAt: now, seq });
      const instrumentIds = fields.instrumentId && !locked.instrumentIds.includes(fields.instrumentId) ? [...locked.instrumentIds, fields.instrumentId] : locked.instrumentIds;
      await repo.updatePractical(tx, id, { instrumentIds, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'practical.entry_saved', entity: 'practical', entityId: id, newValues: { itemId, ...fields, recordedAt: undefined, reason: body.reason } });
    });
    return view(id);
  }

  /** Hold points are witnessed in procedure order; one cannot be passed over to reach a later one. */
  async function witness(actor: Actor, ability: AppAbility, id: string, stepKey: string, note: string | null) {
    const p = await recordablePractical(db, ability, id);
    const holds = await holdPointsOf(db, p.versionId);
    const hold = holds.find((h) => h.key === stepKey);
    if (!hold) throw notFound('That hold point');
    const now = clock.now();
    await db.transaction(async (tx) => {
      await recordablePractical(tx, ability, id, true);
      const done = new Set((await repo.witnessedOf(tx, id)).map((w) => w.stepKey));
      if (done.has(stepKey)) throw conflict(`Hold point ${holds.indexOf(hold) + 1} is already witnessed.`, { stepKey: 'already witnessed' });
      const skipped = holds.find((h) => h.position < hold.position && !done.has(h.key));
      if (skipped) {
        const n = holds.indexOf(skipped) + 1;
        throw conflict(`Hold point ${n} comes first: "${skipped.text}" must be witnessed before this one.`, { stepKey: `hold point ${n} ("${skipped.text}") is not witnessed yet` });
      }
      await repo.insertHoldPoint(tx, { practicalId: id, stepKey, position: hold.position, witnessedAt: now, witnessedBy: actor.id, note, seq: await repo.nextSeq(tx, id) });
      await repo.updatePractical(tx, id, { updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'practical.hold_point_witnessed', entity: 'practical', entityId: id, newValues: { stepKey, position: hold.position, note } });
    });
    return view(id);
  }

  return { saveEntry, witness };
}
