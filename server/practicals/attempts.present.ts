import type { AttemptView, RecordItemView } from '../../shared/practicals/views.js';
import type { Executor } from '../db/client.js';
import type { Lookups } from '../records/items.present.js';
import { instrumentLabels, peopleNames } from '../records/records.repository.js';
import { attemptsOfMany, type AttemptRow } from './attempts.repository.js';

export function presentAttempt(a: AttemptRow, l: Lookups): AttemptView {
  return {
    seq: a.seq, value: a.value, didNotTrip: a.didNotTrip, unit: a.unit, instrument: l.instruments.get(a.instrumentId) ?? 'unknown instrument',
    recordedAt: a.recordedAt.toISOString(), recordedByName: l.names.get(a.recordedBy) ?? 'unknown person',
    verdict: a.verdict as AttemptView['verdict'], expected: a.expected, tolerance: a.tolerance, reason: a.reason,
  };
}

/** Each measurement item with every reading taken for it, in order. */
export function withAttempts(items: RecordItemView[], attempts: AttemptRow[], l: Lookups): RecordItemView[] {
  return items.map((i) => (i.kind === 'measurement' ? { ...i, attempts: attempts.filter((a) => a.itemId === i.id).map((a) => presentAttempt(a, l)) } : i));
}

/** One line per reading, for text records (the incident pack): value, instrument, time, verdict and reason. */
export function attemptLine(a: AttemptView, when: (iso: string) => string) {
  const value = a.didNotTrip ? 'did not trip' : `${a.value} ${a.unit}`;
  const verdict = a.verdict === 'fail' ? 'failed' : a.verdict === 'pass' ? 'passed' : 'not judged';
  return `#${a.seq} ${value} with ${a.instrument} at ${when(a.recordedAt)} by ${a.recordedByName}: ${verdict}${a.reason ? `; taken again because: ${a.reason}` : ''}`;
}

/** Every reading of several practicals taken by a moment, by practical, each with its item's prompt. */
export async function readingsOf(db: Executor, practicalIds: string[], at: Date) {
  const rows = await attemptsOfMany(db, practicalIds, at);
  const [instruments, names] = await Promise.all([instrumentLabels(db, [...new Set(rows.map((r) => r.attempt.instrumentId))]), peopleNames(db, rows.map((r) => r.attempt.recordedBy))]);
  const out = new Map<string, (AttemptView & { prompt: string })[]>();
  for (const { attempt, prompt } of rows) out.set(attempt.practicalId, [...(out.get(attempt.practicalId) ?? []), { ...presentAttempt(attempt, { instruments, names }), prompt }]);
  return out;
}
