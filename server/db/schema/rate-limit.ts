import { sql } from 'drizzle-orm';
import { pgTable, text, integer, timestamp, index, check } from 'drizzle-orm/pg-core';

/**
 * Password attempts per client address (sign-in, forgotten password, signatures, password change), kept
 * in the database so every server process counts against the same window.
 */
export const signinRateLimit = pgTable('signin_rate_limit', {
  key: text('key').primaryKey(),
  hits: integer('hits').notNull(),
  resetAt: timestamp('reset_at', { withTimezone: true, mode: 'date' }).notNull(),
}, (t) => [
  index('signin_rate_limit_reset_idx').on(t.resetAt),
  check('signin_rate_limit_hits_ck', sql`${t.hits} >= 0`),
]);
