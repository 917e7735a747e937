import { and, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { mailLog } from '../db/schema/index.js';

export type OutboxRow = typeof mailLog.$inferSelect;
export type OutboxInsert = typeof mailLog.$inferInsert;

/** Records messages; one whose key is already there is left as it is. Returns the new rows' ids by key. */
export async function insertMessages(db: Executor, rows: OutboxInsert[]): Promise<Map<string, string>> {
  if (!rows.length) return new Map();
  const added = await db.insert(mailLog).values(rows).onConflictDoNothing({ target: mailLog.dedupeKey }).returning({ id: mailLog.id, key: mailLog.dedupeKey });
  return new Map(added.map((r) => [r.key, r.id]));
}

/**
 * Takes due messages no other sender holds, in one short statement, and marks them as being sent: a
 * message waiting for its time, or one left 'sending' since before `staleBefore` (its sender died).
 * The attempt count, raised here, is the claim's token: only this claim may record its outcome.
 */
export async function claimDue(db: Executor, now: Date, staleBefore: Date, limit: number): Promise<OutboxRow[]> {
  const t = now.toISOString();
  const due = db.select({ id: mailLog.id }).from(mailLog)
    .where(and(sql`${mailLog.body} is not null`, sql`((${mailLog.status} = 'waiting' and ${mailLog.nextAttemptAt} <= ${t}::timestamptz)
      or (${mailLog.status} = 'sending' and ${mailLog.claimedAt} < ${staleBefore.toISOString()}::timestamptz))`))
    .orderBy(mailLog.nextAttemptAt, mailLog.createdAt).limit(limit).for('update', { skipLocked: true });
  return db.update(mailLog).set({ status: 'sending', claimedAt: now, attempts: sql`${mailLog.attempts} + 1` })
    .where(inArray(mailLog.id, due)).returning();
}

export type Outcome =
  | { status: 'sent'; fileName: string | null }
  | { status: 'waiting' | 'failed'; error: string; nextAttemptAt: Date };

/** Records what became of a claimed message; false when the claim was taken over meanwhile. */
export async function recordOutcome(db: Executor, row: OutboxRow, outcome: Outcome, now: Date): Promise<boolean> {
  const set = outcome.status === 'sent'
    ? { status: 'sent', fileName: outcome.fileName, sentAt: now, error: null }
    : { status: outcome.status, error: outcome.error.slice(0, 1000), nextAttemptAt: outcome.nextAttemptAt };
  const done = await db.update(mailLog).set(set)
    .where(and(eq(mailLog.id, row.id), eq(mailLog.status, 'sending'), eq(mailLog.attempts, row.attempts))).returning({ id: mailLog.id });
  return done.length === 1;
}

/** Withdraws messages not yet being sent (their cause went away); returns how many. */
export async function withdraw(db: Executor, ids: string[]): Promise<number> {
  if (!ids.length) return 0;
  const done = await db.update(mailLog).set({ status: 'cancelled' })
    .where(and(inArray(mailLog.id, ids), eq(mailLog.status, 'waiting'))).returning({ id: mailLog.id });
  return done.length;
}

export async function nextWaitingAt(db: Executor): Promise<Date | null> {
  const [row] = await db.select({ at: sql<Date>`min(${mailLog.nextAttemptAt})`.mapWith(mailLog.nextAttemptAt) }).from(mailLog).where(eq(mailLog.status, 'waiting'));
  return row?.at ?? null;
}
