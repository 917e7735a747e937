import { and, count, desc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { mailLog } from '../db/schema/index.js';

/** The outbox page: newest first, optionally one status, with the count of each status. */
export async function listMailLog(db: Executor, f: { page: number; pageSize: number; status?: string }) {
  const where = f.status ? eq(mailLog.status, f.status) : undefined;
  const items = await db.select().from(mailLog).where(where).orderBy(desc(mailLog.createdAt), desc(mailLog.id)).limit(f.pageSize).offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(mailLog).where(where);
  const byStatus = await db.select({ status: mailLog.status, n: count() }).from(mailLog).groupBy(mailLog.status);
  return { items, total, counts: Object.fromEntries(byStatus.map((r) => [r.status, r.n])) as Record<string, number> };
}

export async function findMailLog(db: Executor, id: string, lock = false) {
  const q = db.select().from(mailLog).where(eq(mailLog.id, id));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

/** A failed message goes back to waiting, due now, with a fresh round of attempts. */
export async function requeueFailed(db: Executor, id: string, now: Date) {
  const [row] = await db.update(mailLog).set({ status: 'waiting', attempts: 0, nextAttemptAt: now, claimedAt: null })
    .where(and(eq(mailLog.id, id), eq(mailLog.status, 'failed'), sql`${mailLog.body} is not null`)).returning();
  return row;
}
