import { and, asc, count, desc, eq, inArray, isNull, lte, sql, type SQL } from 'drizzle-orm';
import type { Delivered } from '../mail/mailer.js';
import type { Executor } from '../db/client.js';
import { reminderSends, users } from '../db/schema/index.js';

export type SendRow = typeof reminderSends.$inferSelect;

/**
 * Pending reminders about an end that has moved since they were planned (the due moment no longer
 * matches the period's end less the offset) are cancelled; planning records the new end's own.
 */
export async function cancelMoved(db: Executor): Promise<string[]> {
  const r = (await db.execute(sql`update reminder_sends s set status = 'cancelled'
    from authorisation_periods p
    where s.period_id = p.id and s.status = 'pending' and s.offset_days > 0
      and s.due_at <> p.ends_at - make_interval(days => s.offset_days)
    returning s.mail_id`)) as unknown as { rows: { mail_id: string | null }[] };
  // Their messages already in the outbox are withdrawn by the caller.
  return r.rows.flatMap((row) => (row.mail_id ? [row.mail_id] : []));
}

/**
 * Takes due sends not yet handed to the mail outbox that no other worker holds: a send is in one worker's
 * hands at a time, until its transaction ends. Sends about one record come together, so a batch reads
 * that record once.
 */
export async function claimDue(tx: Executor, now: Date, limit: number): Promise<SendRow[]> {
  return tx.select().from(reminderSends)
    .where(and(eq(reminderSends.status, 'pending'), isNull(reminderSends.mailId), lte(reminderSends.nextAttemptAt, now)))
    .orderBy(asc(reminderSends.nextAttemptAt), sql`coalesce(${reminderSends.periodId}, ${reminderSends.certificateId})`, asc(reminderSends.id))
    .limit(limit)
    .for('update', { skipLocked: true });
}

/** Links sends to the outbox messages that carry them, in one statement; they stay pending until sent. */
export async function markQueued(tx: Executor, queued: { id: string; mail_id: string }[]) {
  if (!queued.length) return;
  await tx.execute(sql`update reminder_sends s set mail_id = x.mail_id
    from jsonb_to_recordset(${JSON.stringify(queued)}::jsonb) as x(id uuid, mail_id uuid)
    where s.id = x.id`);
}

/**
 * Mirrors what became of each send's message (outbox key `reminder:<send id>`): sent only once the mail
 * server has taken it; otherwise its attempts, error and next attempt. A cancelled send stays cancelled.
 */
export async function recordDelivery(tx: Executor, outcomes: Delivered[]) {
  if (!outcomes.length) return;
  const rows = outcomes.map((o) => ({
    id: o.key.slice('reminder:'.length), sent_at: o.status === 'sent' ? o.at.toISOString() : null, attempts: o.attempts, error: o.error, next_at: o.nextAttemptAt.toISOString(),
  }));
  await tx.execute(sql`update reminder_sends s set status = case when x.sent_at is null then s.status else 'sent' end, sent_at = x.sent_at,
      attempts = x.attempts, last_error = x.error, next_attempt_at = x.next_at
    from jsonb_to_recordset(${JSON.stringify(rows)}::jsonb) as x(id uuid, sent_at timestamptz, attempts int, error text, next_at timestamptz)
    where s.id = x.id and s.status = 'pending'`);
}

export async function cancelSends(tx: Executor, ids: string[]) {
  if (ids.length) await tx.update(reminderSends).set({ status: 'cancelled' }).where(inArray(reminderSends.id, ids));
}

export async function nextPendingAt(db: Executor): Promise<Date | null> {
  const [row] = await db.select({ at: sql<Date>`min(${reminderSends.nextAttemptAt})`.mapWith(reminderSends.nextAttemptAt) }).from(reminderSends).where(eq(reminderSends.status, 'pending'));
  return row?.at ?? null;
}

export async function recipientsOf(db: Executor, ids: string[]) {
  if (!ids.length) return new Map<string, { id: string; name: string; email: string; active: boolean }>();
  const rows = await db.select({ id: users.id, name: users.name, email: users.email, active: users.active }).from(users).where(inArray(users.id, [...new Set(ids)]));
  return new Map(rows.map((r) => [r.id, r]));
}

export async function listSends(db: Executor, f: { siteIds: string[] | null; status?: string; page: number; pageSize: number }) {
  const conds: SQL[] = [];
  if (f.siteIds) conds.push(f.siteIds.length ? inArray(users.siteId, f.siteIds) : sql`false`);
  if (f.status) conds.push(eq(reminderSends.status, f.status));
  const where = and(...conds);
  const items = await db.select({ send: reminderSends, recipientName: users.name, recipientEmail: users.email }).from(reminderSends)
    .innerJoin(users, eq(users.id, reminderSends.recipientId)).where(where)
    .orderBy(desc(reminderSends.createdAt), desc(reminderSends.id)).limit(f.pageSize).offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(reminderSends).innerJoin(users, eq(users.id, reminderSends.recipientId)).where(where);
  return { items, total };
}
