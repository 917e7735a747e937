import { sql } from 'drizzle-orm';
import { pgTable, uuid, text, timestamp, index, check } from 'drizzle-orm/pg-core';
import { sites, users } from './core.js';

const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

/**
 * What an auditor found about one record (any kind: entity and entityId), with the site of that record so
 * its managers answer it. The label is frozen when raised, so the finding still reads right if the record
 * changes later. Open → answered → closed; a manager may also close it straight away with a note.
 */
export const findings = pgTable('findings', {
  id: uuid('id').primaryKey().defaultRandom(),
  entity: text('entity').notNull(),
  entityId: text('entity_id').notNull(),
  recordLabel: text('record_label').notNull(),
  siteId: uuid('site_id').references(() => sites.id),
  severity: text('severity').notNull(),
  status: text('status').notNull(),
  text: text('text').notNull(),
  raisedBy: uuid('raised_by').notNull().references(() => users.id),
  raisedAt: ts('raised_at').notNull(),
  response: text('response'),
  answeredBy: uuid('answered_by').references(() => users.id),
  answeredAt: ts('answered_at'),
  closingNote: text('closing_note'),
  closedBy: uuid('closed_by').references(() => users.id),
  closedAt: ts('closed_at'),
}, (t) => [
  index('findings_status_idx').on(t.status, t.raisedAt),
  index('findings_site_idx').on(t.siteId, t.status, t.raisedAt),
  index('findings_record_idx').on(t.entity, t.entityId),
  check('findings_entity_ck', sql`${t.entity} in ('person', 'authorisation', 'procedure_version', 'practical', 'signoff', 'bench', 'bench_check', 'instrument', 'certificate', 'evidence', 'audit_entry')`),
  check('findings_severity_ck', sql`${t.severity} in ('observation', 'minor', 'major', 'critical')`),
  check('findings_status_ck', sql`${t.status} in ('open', 'answered', 'closed')`),
  check('findings_text_ck', sql`length(${t.text}) between 3 and 4000`),
  check('findings_answered_ck', sql`(${t.response} is null) = (${t.answeredAt} is null) and (${t.answeredAt} is null) = (${t.answeredBy} is null) and (${t.status} <> 'answered' or ${t.response} is not null)`),
  check('findings_closed_ck', sql`(${t.status} = 'closed') = (${t.closedAt} is not null) and (${t.closedAt} is null or (${t.closedBy} is not null and length(${t.closingNote}) >= 3))`),
]);
