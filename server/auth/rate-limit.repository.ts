import { and, eq, gt, lte, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { signinRateLimit as t } from '../db/schema/index.js';

/**
 * One hit for `key`, atomically: a new row, one more in the running window, or a fresh window when the
 * stored one has ended. Concurrent hits from any number of processes serialise on the row.
 */
export async function hit(db: Executor, key: string, now: Date, windowMs: number) {
  const fresh = sql`${t.resetAt} <= ${now}`;
  const [row] = await db
    .insert(t)
    .values({ key, hits: 1, resetAt: new Date(now.getTime() + windowMs) })
    .onConflictDoUpdate({
      target: t.key,
      set: {
        hits: sql`case when ${fresh} then 1 else ${t.hits} + 1 end`,
        resetAt: sql`case when ${fresh} then excluded.reset_at else ${t.resetAt} end`,
      },
    })
    .returning({ hits: t.hits, resetAt: t.resetAt });
  return row!;
}

/** Takes back one hit in the running window (a request that turned out not to count). */
export async function unhit(db: Executor, key: string, now: Date) {
  await db.update(t).set({ hits: sql`greatest(${t.hits} - 1, 0)` }).where(and(eq(t.key, key), gt(t.resetAt, now)));
}

export async function current(db: Executor, key: string, now: Date) {
  const [row] = await db.select({ hits: t.hits, resetAt: t.resetAt }).from(t).where(and(eq(t.key, key), gt(t.resetAt, now)));
  return row;
}

export async function forget(db: Executor, key: string) {
  await db.delete(t).where(eq(t.key, key));
}

/** Drops windows that have ended; a key hit again starts a new one anyway. */
export async function pruneEnded(db: Executor, now: Date): Promise<number> {
  const gone = await db.delete(t).where(lte(t.resetAt, now)).returning({ key: t.key });
  return gone.length;
}
