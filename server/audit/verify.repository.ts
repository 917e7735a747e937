import { sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { rowsOf } from '../register/rows.js';
import type { SealedFields } from './audit.hash.js';

/** An entry as sealing hashed it, with its seal when it has one. */
export type WalkRow = SealedFields & { seal: { prevId: number; hmac: string } | null };

type Raw = {
  id: string; at: Date; actor_id: string | null; action: string; entity: string; entity_id: string; old_values: unknown; new_values: unknown;
  prev_id: string | null; hmac: string | null;
};

/** Entries after `afterId` in id order, each with its seal when it has one. */
export async function walkBatch(db: Executor, afterId: number, limit: number): Promise<WalkRow[]> {
  const rows = await rowsOf<Raw>(db, sql`select l.id, l.at, l.actor_id, l.action, l.entity, l.entity_id, l.old_values, l.new_values, s.prev_id, s.hmac
    from audit_log l left join audit_seal s on s.entry_id = l.id where l.id > ${afterId} order by l.id limit ${limit}`);
  return rows.map((x) => ({
    id: Number(x.id), at: new Date(x.at), actorId: x.actor_id, action: x.action, entity: x.entity,
    entityId: x.entity_id, oldValues: x.old_values, newValues: x.new_values,
    seal: x.hmac === null ? null : { prevId: Number(x.prev_id), hmac: x.hmac },
  }));
}

/** Seals whose entry is gone (possible only with the guards switched off). */
export async function orphanSeals(db: Executor): Promise<number[]> {
  const rows = await rowsOf<{ entry_id: string }>(db, sql`select s.entry_id from audit_seal s where not exists (select 1 from audit_log l where l.id = s.entry_id) order by 1`);
  return rows.map((x) => Number(x.entry_id));
}

/** For anchored ids: the seal's hmac, and whether the entry itself is still there. */
export async function anchoredSeals(db: Executor, ids: number[]): Promise<Map<number, { hmac: string; entry: boolean }>> {
  if (!ids.length) return new Map();
  const rows = await rowsOf<{ entry_id: string; hmac: string; entry: boolean }>(db, sql`select s.entry_id, s.hmac, exists (select 1 from audit_log l where l.id = s.entry_id) as entry
    from audit_seal s where s.entry_id = any(${`{${ids.join(',')}}`}::bigint[])`);
  return new Map(rows.map((x) => [Number(x.entry_id), { hmac: x.hmac, entry: x.entry }]));
}
