import { sql } from 'drizzle-orm';
import { pgTable, uuid, text, integer, timestamp, date, index, uniqueIndex, check } from 'drizzle-orm/pg-core';
import { users } from './core.js';
import { signatures } from './signatures.js';
import { procedures, procedureVersions } from './procedures.js';

const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

/** "I will work to this version": one signed acknowledgement per person and version. */
export const procedureAcknowledgements = pgTable('procedure_acknowledgements', {
  id: uuid('id').primaryKey().defaultRandom(),
  procedureId: uuid('procedure_id').notNull().references(() => procedures.id),
  versionId: uuid('version_id').notNull().references(() => procedureVersions.id),
  versionNumber: integer('version_number').notNull(),
  userId: uuid('user_id').notNull().references(() => users.id),
  signatureId: uuid('signature_id').notNull().references(() => signatures.id),
  acknowledgedAt: ts('acknowledged_at').notNull(),
}, (t) => [
  uniqueIndex('procedure_acks_version_user_uq').on(t.versionId, t.userId),
  uniqueIndex('procedure_acks_signature_uq').on(t.signatureId),
  index('procedure_acks_procedure_user_idx').on(t.procedureId, t.userId, t.versionNumber),
  index('procedure_acks_user_idx').on(t.userId),
]);

/** Asked of a person when a re-read or re-assess version is published; answered by acknowledging it. */
export const procedureRereadRequests = pgTable('procedure_reread_requests', {
  id: uuid('id').primaryKey().defaultRandom(),
  procedureId: uuid('procedure_id').notNull().references(() => procedures.id),
  versionId: uuid('version_id').notNull().references(() => procedureVersions.id),
  userId: uuid('user_id').notNull().references(() => users.id),
  changeClass: text('change_class').notNull(),
  dueOn: date('due_on', { mode: 'string' }).notNull(),
  createdAt: ts('created_at').notNull(),
  extendedAt: ts('extended_at'),
  extendedBy: uuid('extended_by').references(() => users.id),
  extensionReason: text('extension_reason'),
}, (t) => [
  uniqueIndex('procedure_reread_version_user_uq').on(t.versionId, t.userId),
  index('procedure_reread_user_idx').on(t.userId),
  check('procedure_reread_class_ck', sql`${t.changeClass} in ('re-read', 're-assess')`),
  check('procedure_reread_extension_ck', sql`(${t.extendedAt} is null) = (${t.extensionReason} is null)`),
]);

/** One review-due reminder per (version, manager, offset); a row without sentAt is retried. */
export const procedureReviewReminders = pgTable('procedure_review_reminders', {
  id: uuid('id').primaryKey().defaultRandom(),
  versionId: uuid('version_id').notNull().references(() => procedureVersions.id),
  managerId: uuid('manager_id').notNull().references(() => users.id),
  offsetDays: integer('offset_days').notNull(),
  reviewDueOn: date('review_due_on', { mode: 'string' }).notNull(),
  createdAt: ts('created_at').notNull(),
  claimedAt: ts('claimed_at'),
  sentAt: ts('sent_at'),
  attempts: integer('attempts').notNull().default(0),
  lastError: text('last_error'),
}, (t) => [
  uniqueIndex('procedure_review_reminders_uq').on(t.versionId, t.managerId, t.offsetDays),
  index('procedure_review_reminders_unsent_idx').on(t.createdAt).where(sql`${t.sentAt} is null`),
  check('procedure_review_reminders_offset_ck', sql`${t.offsetDays} between 0 and 365`),
]);
