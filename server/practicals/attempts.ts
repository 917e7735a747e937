import type { Executor } from '../db/client.js';
import type { EntryFields } from '../records/records.repository.js';
import { unprocessable } from '../errors.js';
import { insertAttempt, lastAttempt } from './attempts.repository.js';

interface Attempt { id: string; itemId: string; seq: number; fields: EntryFields; reason: string | null; now: Date; actorId: string }

/** Every reading stays in the record: one taken again needs a reason, and the earlier one is kept beside it. */
export async function keepAttempt(tx: Executor, a: Attempt) {
  const before = await lastAttempt(tx, a.id, a.itemId);
  if (before && !a.reason) {
    const was = before.didNotTrip ? 'did not trip' : `${before.value} ${before.unit}`;
    const why = `this item already has a reading (${was}${before.verdict ? `, ${before.verdict === 'fail' ? 'failed' : 'passed'}` : ''}); say why it is taken again`;
    throw unprocessable(`reason: ${why}`, { reason: why });
  }
  const f = a.fields;
  await insertAttempt(tx, {
    practicalId: a.id, itemId: a.itemId, seq: a.seq, value: f.value, didNotTrip: f.didNotTrip, unit: f.unit!, instrumentId: f.instrumentId!,
    expected: f.expected, tolerance: f.tolerance, verdict: f.verdict, judgedBy: f.judgedBy, reason: a.reason, recordedAt: a.now, recordedBy: a.actorId,
  });
}
