import { and, asc, desc, gt, lte, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { auditLog, auditSeal } from '../db/schema/index.js';
import { rowsOf } from '../register/rows.js';

// One advisory lock key for sealing: held only while one batch of seals is written.
const SEAL_LOCK = 0x42_4f_53_4c; // "BOSL"

/** A point in time to seal up to: every number up to `hi` was taken by a transaction whose id is below `xid`. */
export interface SealMark {
  hi: number;
  xid: bigint;
}

/** The highest number handed out, then a fresh transaction id (the writers' trigger takes its xid first). */
export async function takeMark(db: Executor): Promise<SealMark> {
  const [seq] = await rowsOf<{ hi: string }>(db, sql`select case when is_called then last_value else 0 end as hi from audit_log_id_seq`);
  const [own] = await rowsOf<{ xid: string }>(db, sql`select pg_current_xact_id()::text as xid`);
  return { hi: Number(seq.hi), xid: BigInt(own.xid) };
}

/** The oldest transaction still running: every transaction id below it has committed or rolled back. */
export async function oldestRunning(db: Executor): Promise<bigint> {
  const [r] = await rowsOf<{ xmin: string }>(db, sql`select pg_snapshot_xmin(pg_current_snapshot())::text as xmin`);
  return BigInt(r.xmin);
}

export async function withSealLock<T>(db: Executor, fn: (tx: Executor) => Promise<T>): Promise<T> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${SEAL_LOCK})`);
    return fn(tx);
  });
}

export async function sealHead(db: Executor): Promise<{ id: number; hmac: string } | null> {
  const [row] = await db.select({ id: auditSeal.entryId, hmac: auditSeal.hmac }).from(auditSeal).orderBy(desc(auditSeal.entryId)).limit(1);
  return row ?? null;
}

export async function entriesAfter(db: Executor, afterId: number, upTo: number, limit: number) {
  return db.select().from(auditLog).where(and(gt(auditLog.id, afterId), lte(auditLog.id, upTo))).orderBy(asc(auditLog.id)).limit(limit);
}

export async function insertSeals(db: Executor, rows: (typeof auditSeal.$inferInsert)[]): Promise<void> {
  if (rows.length) await db.insert(auditSeal).values(rows);
}
