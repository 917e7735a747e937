import type { Executor } from '../db/client.js';
import { auditBatch } from './audit.repository.js';
import { auditHash, GENESIS_HASH } from './audit.hash.js';

export type ChainReport =
  | { intact: true; entries: number }
  | { intact: false; entries: number; firstBadId: number; reason: 'hash' | 'link' };

/** Recomputes the whole chain in id order, in batches, and names the first entry that does not match. */
export async function verifyChain(db: Executor, batchSize = 2000): Promise<ChainReport> {
  let prev = GENESIS_HASH;
  let lastId = 0;
  let entries = 0;
  for (;;) {
    const rows = await auditBatch(db, lastId, batchSize);
    if (!rows.length) return { intact: true, entries };
    for (const r of rows) {
      entries++;
      if (r.prevHash !== prev) return { intact: false, entries, firstBadId: r.id, reason: 'link' };
      const expected = auditHash(prev, { at: r.at, actorId: r.actorId, action: r.action, entity: r.entity, entityId: r.entityId, oldValues: r.oldValues, newValues: r.newValues });
      if (expected !== r.hash) return { intact: false, entries, firstBadId: r.id, reason: 'hash' };
      prev = r.hash;
      lastId = r.id;
    }
  }
}
