import { and, asc, count, desc, eq, inArray, lte, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { reminderSends, users } from '../db/schema/index.js';

export type SendRow = typeof reminderSends.$inferSelect;

/**
 * Pending reminders about an end that has moved since they were planned (the due moment no longer
 * matches the period's end less the offset) are cancelled; planning records the new end's own.
 */
export async function cancelMoved(db: Executor): Promise<number> {
  const r = await db.execute(sql`update reminder_sends s set status = 'cancelled'
    from authorisation_periods p
    where s.period_id = p.id and s.status = 'pending' and s.offset_days > 0
      and s.due_at <> p.ends_at - make_interval(days => s.offset_days)`);
  return (r as unknown as { rowCount: number | null }).rowCount ?? 0;
}

/**
 * Takes due sends no other worker holds: a send is in one worker's hands at a time, until its transaction
 * ends. Sends about one record come together, so a batch reads that record once.
 */
export async function claimDue(tx: Executor, now: Date, limit: number): Promise<SendRow[]> {
  return tx.select().from(reminderSends)
    .where(and(eq(reminderSends.status, 'pending'), lte(reminderSends.nextAttemptAt, now)))
    .orderBy(asc(reminderSends.nextAttemptAt), sql`coalesce(${reminderSends.periodId}, ${reminderSends.certificateId})`, asc(reminderSends.id))
    .limit(limit)
    .for('update', { skipLocked: true });
}

/** Marks sends as sent, each with the mail that carried it, in one statement. */
export async function markSent(tx: Executor, sent: { id: string; mail_id: string }[], now: Date) {
  if (!sent.length) return;
  await tx.execute(sql`update reminder_sends s set status = 'sent', sent_at = ${now.toISOString()}::timestamptz, mail_id = x.mail_id, last_error = null
    from jsonb_to_recordset(${JSON.stringify(sent)}::jsonb) as x(id uuid, mail_id uuid)
    where s.id = x.id`);
}

export async function markFailed(tx: Executor, id: string, attempts: number, nextAttemptAt: Date, error: string) {
  await tx.update(reminderSends).set({ attempts, nextAttemptAt, lastError: error.slice(0, 1000) }).where(eq(reminderSends.id, id));
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
