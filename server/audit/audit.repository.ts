import { sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import type { AuditFields } from './audit.hash.js';

/**
 * Must run inside the transaction of the change it records. Only appends: no lock and no read of the
 * chain, so a long transaction never holds up anyone else's. The trigger stamps the transaction id and
 * then the sequence number; the seal comes after commit (sealer.ts).
 */
export async function appendAudit(tx: Executor, entry: AuditFields): Promise<void> {
  await tx.execute(sql`insert into audit_log (at, actor_id, action, entity, entity_id, old_values, new_values)
    values (${entry.at.toISOString()}::timestamptz, ${entry.actorId}, ${entry.action}, ${entry.entity}, ${entry.entityId},
      ${json(entry.oldValues)}::jsonb, ${json(entry.newValues)}::jsonb)`);
}

// jsonb keeps what JSON can hold; undefined and null are both SQL null.
function json(v: unknown): string | null {
  return v === undefined || v === null ? null : JSON.stringify(v);
}
