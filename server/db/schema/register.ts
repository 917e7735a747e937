import { sql } from 'drizzle-orm';
import { pgTable, uuid, text, timestamp, index, customType } from 'drizzle-orm/pg-core';
import { authorisationPeriods } from './authorisations.js';

// Read and written only by the database (see drizzle/0015_register_spans_derived.sql).
const tstzrange = customType<{ data: string; driverData: string }>({ dataType: () => 'tstzrange' });
const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

/**
 * The state of each authorisation over time, as spans of constant state: derived by the database from the
 * periods and their events (the same fold as foldState) every time either changes, in the same
 * transaction. Spans of one authorisation partition the time from its first period on, so "the register
 * at a moment" is the spans with from_at <= moment < to_at, read from btree indexes (index-only for counts)
 * instead of folding every row.
 */
export const authorisationStateSpans = pgTable('authorisation_state_spans', {
  periodId: uuid('period_id').notNull().references(() => authorisationPeriods.id),
  authorisationId: uuid('authorisation_id').notNull(),
  holderId: uuid('holder_id').notNull(),
  scopeId: uuid('scope_id').notNull(),
  state: text('state').notNull(),
  since: ts('since').notNull(),
  span: tstzrange('span').notNull(),
  // The span's bounds as plain columns, so btree indexes can hold them ('infinity' when open-ended).
  fromAt: ts('from_at').generatedAlwaysAs(sql`lower(span)`),
  toAt: ts('to_at').generatedAlwaysAs(sql`upper(span)`),
}, (t) => [
  index('authorisation_state_spans_authorisation_idx').on(t.authorisationId, t.toAt, t.fromAt),
  index('authorisation_state_spans_moment_idx').on(t.toAt, t.fromAt),
  index('authorisation_state_spans_state_idx').on(t.state, t.toAt, t.fromAt),
  index('authorisation_state_spans_holder_idx').on(t.holderId, t.toAt, t.fromAt),
  index('authorisation_state_spans_scope_idx').on(t.scopeId, t.toAt, t.fromAt),
  index('authorisation_state_spans_period_idx').on(t.periodId),
]);
