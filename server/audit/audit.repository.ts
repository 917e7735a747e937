import { desc, sql, asc, gt } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { auditLog } from '../db/schema/index.js';
import { auditHash, GENESIS_HASH, type AuditFields } from './audit.hash.js';

// One advisory lock key for the chain head: appends queue here so two writers never share a parent.
const CHAIN_LOCK = 0x42_4f_41_55; // "BOAU"

/** Must run inside the transaction of the change it records. */
export async function appendAudit(tx: Executor, entry: AuditFields): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(${CHAIN_LOCK})`);
  const [head] = await tx.select({ hash: auditLog.hash }).from(auditLog).orderBy(desc(auditLog.id)).limit(1);
  const prevHash = head?.hash ?? GENESIS_HASH;
  const oldValues = normalise(entry.oldValues);
  const newValues = normalise(entry.newValues);
  const hash = auditHash(prevHash, { ...entry, oldValues, newValues });
  await tx.insert(auditLog).values({ ...entry, oldValues, newValues, prevHash, hash });
}

// jsonb keeps what JSON can hold; normalising first makes the hashed value equal the stored one.
function normalise(v: unknown): unknown {
  return v === undefined || v === null ? null : JSON.parse(JSON.stringify(v));
}

export async function auditBatch(db: Executor, afterId: number, limit: number) {
  return db.select().from(auditLog).where(gt(auditLog.id, afterId)).orderBy(asc(auditLog.id)).limit(limit);
}
