import { sql } from 'drizzle-orm';
import { pgTable, uuid, text, timestamp, index, check } from 'drizzle-orm/pg-core';
import { users } from './core.js';

/**
 * An electronic signature: who signed (with the name printed as it was at that moment), when, what the
 * signature means, and the record it is on. The password was re-entered to make it.
 */
export const signatures = pgTable('signatures', {
  id: uuid('id').primaryKey().defaultRandom(),
  signerId: uuid('signer_id').notNull().references(() => users.id),
  printedName: text('printed_name').notNull(),
  meaning: text('meaning').notNull(),
  entity: text('entity').notNull(),
  entityId: text('entity_id').notNull(),
  signedAt: timestamp('signed_at', { withTimezone: true, mode: 'date' }).notNull(),
}, (t) => [
  index('signatures_entity_idx').on(t.entity, t.entityId),
  index('signatures_signer_idx').on(t.signerId, t.signedAt),
  check('signatures_meaning_ck', sql`length(${t.meaning}) between 3 and 200`),
]);
