import { bigint, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import { auditLog } from './core.js';

/**
 * The chain over audit_log, one seal per entry, written after the entry's transaction committed by one
 * sealer at a time. Append-only like audit_log (INSERT and SELECT for the app role; a trigger refuses
 * the rest), so the trail itself stays strictly insert-only. `prev_id` names the entry sealed before
 * (0 for the first; ids start at 1): unique, so two seals can never claim the same predecessor.
 */
export const auditSeal = pgTable('audit_seal', {
  entryId: bigint('entry_id', { mode: 'number' }).primaryKey().references(() => auditLog.id),
  prevId: bigint('prev_id', { mode: 'number' }).notNull(),
  // HMAC-SHA-256 (hex) over the entry, its id, prev_id and the previous seal's hmac, with the audit key.
  hmac: text('hmac').notNull(),
  sealedAt: timestamp('sealed_at', { withTimezone: true, mode: 'date' }).notNull(),
}, (t) => [
  uniqueIndex('audit_seal_prev_uq').on(t.prevId),
]);
