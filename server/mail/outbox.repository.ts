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

/**
 * Records what became of claimed messages, in one statement; returns the ids recorded. A message whose
 * claim was taken over meanwhile (its attempt count moved on) is left to the newer claim.
 */
export async function recordOutcomes(db: Executor, done: { row: OutboxRow; outcome: Outcome }[], now: Date): Promise<Set<string>> {
  if (!done.length) return new Set();
  const rows = done.map(({ row, outcome: o }) => ({
    id: row.id, attempts: row.attempts, status: o.status,
    ...(o.status === 'sent' ? { file_name: o.fileName, sent_at: now.toISOString() } : { error: o.error.slice(0, 1000), next_at: o.nextAttemptAt.toISOString() }),
  }));
  const r = (await db.execute(sql`update mail_log m set status = x.status, file_name = coalesce(x.file_name, m.file_name), sent_at = x.sent_at,
      error = x.error, next_attempt_at = coalesce(x.next_at, m.next_attempt_at)
    from jsonb_to_recordset(${JSON.stringify(rows)}::jsonb) as x(id uuid, attempts int, status text, file_name text, sent_at timestamptz, error text, next_at timestamptz)
    where m.id = x.id and m.status = 'sending' and m.attempts = x.attempts
    returning m.id`)) as unknown as { rows: { id: string }[] };
  return new Set(r.rows.map((row) => row.id));
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
