import { sql } from 'drizzle-orm';
import { check, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './core.js';

const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

/**
 * A large CSV import of paper authorisations, run by the job queue rather than the browser's request:
 * the file, who asked and signed, and progress the manager's page polls. Progress is written outside the
 * import's own transaction, which still writes every row or none.
 */
export const authorisationImportJobs = pgTable('authorisation_import_jobs', {
  id: uuid('id').primaryKey().defaultRandom(),
  actorId: uuid('actor_id').notNull().references(() => users.id),
  printedName: text('printed_name').notNull(),
  csv: text('csv').notNull(),
  status: text('status').notNull(),
  total: integer('total').notNull(),
  done: integer('done').notNull().default(0),
  written: jsonb('written'),
  error: text('error'),
  createdAt: ts('created_at').notNull(),
  startedAt: ts('started_at'),
  finishedAt: ts('finished_at'),
}, (t) => [
  index('authorisation_import_jobs_actor_idx').on(t.actorId, t.createdAt),
  check('authorisation_import_jobs_status_ck', sql`${t.status} in ('queued', 'running', 'done', 'failed')`),
]);
