import { pgTable, uuid, text, timestamp, index, customType } from 'drizzle-orm/pg-core';
import { authorisationPeriods } from './authorisations.js';

// Read and written only by the database (see drizzle/0015_register_spans.sql).
const tstzrange = customType<{ data: string; driverData: string }>({ dataType: () => 'tstzrange' });

/**
 * The state of each authorisation over time, as spans of constant state: derived by the database from the
 * periods and their events (the same fold as foldState) every time either changes, in the same
 * transaction. Spans of one authorisation partition the time from its first period on, so "the register
 * at a moment" is the spans containing that moment, found through a GiST index instead of a fold per row.
 */
export const authorisationStateSpans = pgTable('authorisation_state_spans', {
  periodId: uuid('period_id').notNull().references(() => authorisationPeriods.id),
  authorisationId: uuid('authorisation_id').notNull(),
  holderId: uuid('holder_id').notNull(),
  scopeId: uuid('scope_id').notNull(),
  state: text('state').notNull(),
  since: timestamp('since', { withTimezone: true, mode: 'date' }).notNull(),
  span: tstzrange('span').notNull(),
}, (t) => [
  index('authorisation_state_spans_span_idx').using('gist', t.span),
  index('authorisation_state_spans_state_span_idx').using('gist', t.state, t.span),
  index('authorisation_state_spans_authorisation_idx').on(t.authorisationId),
  index('authorisation_state_spans_holder_idx').on(t.holderId),
  index('authorisation_state_spans_period_idx').on(t.periodId),
]);
