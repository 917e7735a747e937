import type { Executor } from '../db/client.js';
import type { EvaluationContext } from './writer.js';
import { Writer } from './writer.js';
import { runningOf } from './standing.js';
import { cancelPendingFor } from './reminders-link.repository.js';

/**
 * A person who leaves: every authorisation running now ends at this moment with the reason given, and
 * reminders not yet sent to or about them are cancelled. Runs inside the deactivation's transaction.
 */
export async function endAuthorisationsOf(tx: Executor, personId: string, ctx: EvaluationContext & { reason: string }) {
  const now = ctx.clock.now();
  const w = new Writer(tx, ctx, now);
  for (const st of await runningOf(tx, personId, now)) {
    await w.event(st, { kind: 'ended', effectiveAt: now, actorId: ctx.actorId ?? null, reason: `The holder left: ${ctx.reason}` });
    await w.moveEnd(st, now, 'The holder left.');
  }
  await cancelPendingFor(tx, personId);
  return w.changes;
}
