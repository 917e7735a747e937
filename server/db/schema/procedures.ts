import { sql } from 'drizzle-orm';
import { pgTable, uuid, text, integer, boolean, timestamp, date, jsonb, index, uniqueIndex, check, type AnyPgColumn } from 'drizzle-orm/pg-core';
import { sites, users } from './core.js';
import { signatures } from './signatures.js';

const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });
const dateStr = (name: string) => date(name, { mode: 'string' });

/** One controlled document; its content lives in its versions. */
export const procedures = pgTable('procedures', {
  id: uuid('id').primaryKey().defaultRandom(),
  code: text('code').notNull(),
  // The owning site: its time zone dates the review and its managers are reminded.
  siteId: uuid('site_id').notNull().references(() => sites.id),
  ownerId: uuid('owner_id').notNull().references(() => users.id),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
  updatedBy: uuid('updated_by').notNull().references(() => users.id),
}, (t) => [
  uniqueIndex('procedures_code_uq').on(t.code),
  index('procedures_updated_idx').on(t.updatedAt),
  check('procedures_code_ck', sql`${t.code} ~ '^[A-Z0-9][A-Z0-9-]{2,23}$'`),
]);

export const procedureVersions = pgTable('procedure_versions', {
  id: uuid('id').primaryKey().defaultRandom(),
  procedureId: uuid('procedure_id').notNull().references(() => procedures.id),
  number: integer('number').notNull(),
  status: text('status').notNull(),
  basedOnId: uuid('based_on_id').references((): AnyPgColumn => procedureVersions.id),
  title: text('title').notNull(),
  category: text('category').notNull(),
  reviewPeriodMonths: integer('review_period_months').notNull(),
  scope: text('scope').notNull(),
  hazards: text('hazards').array().notNull(),
  ppe: text('ppe').array().notNull(),
  equipment: text('equipment').array().notNull(),
  changeClass: text('change_class'),
  changeSummary: text('change_summary'),
  rereadDays: integer('reread_days').notNull(),
  authorId: uuid('author_id').notNull().references(() => users.id),
  // Everyone else who saved this draft: none of them may approve it either.
  editorIds: uuid('editor_ids').array().notNull().default(sql`'{}'::uuid[]`),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
  submittedAt: ts('submitted_at'),
  returnedAt: ts('returned_at'),
  returnedBy: uuid('returned_by').references(() => users.id),
  returnComment: text('return_comment'),
  approvedBy: uuid('approved_by').references(() => users.id),
  approvalSignatureId: uuid('approval_signature_id').references(() => signatures.id),
  publishedAt: ts('published_at'),
  reviewDueOn: dateStr('review_due_on'),
  // Acknowledgements of this version number or later count; practicals likewise from assessFrom.
  ackFromNumber: integer('ack_from_number'),
  assessFromNumber: integer('assess_from_number'),
  supersededAt: ts('superseded_at'),
  withdrawnAt: ts('withdrawn_at'),
  withdrawnBy: uuid('withdrawn_by').references(() => users.id),
  withdrawnReason: text('withdrawn_reason'),
}, (t) => [
  uniqueIndex('procedure_versions_number_uq').on(t.procedureId, t.number),
  // Exactly one version in force per procedure, and at most one being worked on.
  uniqueIndex('procedure_versions_one_published_uq').on(t.procedureId).where(sql`${t.status} = 'published'`),
  uniqueIndex('procedure_versions_one_open_uq').on(t.procedureId).where(sql`${t.status} in ('draft', 'in_review')`),
  index('procedure_versions_review_due_idx').on(t.reviewDueOn).where(sql`${t.status} = 'published'`),
  check('procedure_versions_number_ck', sql`${t.number} >= 1`),
  check('procedure_versions_status_ck', sql`${t.status} in ('draft', 'in_review', 'published', 'superseded', 'withdrawn')`),
  check('procedure_versions_category_ck', sql`${t.category} in ('dead-work', 'live-testing', 'live-fault-finding', 'commissioning', 'bench-equipment', 'general')`),
  check('procedure_versions_class_ck', sql`${t.changeClass} is null or ${t.changeClass} in ('editorial', 're-read', 're-assess')`),
  check('procedure_versions_period_ck', sql`${t.reviewPeriodMonths} between 1 and 60`),
  check('procedure_versions_reread_ck', sql`${t.rereadDays} between 1 and 180`),
  check('procedure_versions_later_states_class_ck', sql`${t.number} = 1 or ${t.status} = 'draft' or (${t.changeClass} is not null and length(${t.changeSummary}) > 0)`),
  check('procedure_versions_published_ck', sql`${t.status} in ('draft', 'in_review') or (${t.approvalSignatureId} is not null and ${t.publishedAt} is not null and ${t.reviewDueOn} is not null and ${t.ackFromNumber} is not null)`),
  check('procedure_versions_four_eyes_ck', sql`${t.approvedBy} is null or (${t.approvedBy} <> ${t.authorId} and not (${t.approvedBy} = any(${t.editorIds})))`),
  check('procedure_versions_withdrawn_ck', sql`${t.status} <> 'withdrawn' or (${t.withdrawnAt} is not null and length(${t.withdrawnReason}) >= 3)`),
]);

export const procedureSteps = pgTable('procedure_steps', {
  id: uuid('id').primaryKey().defaultRandom(),
  versionId: uuid('version_id').notNull().references(() => procedureVersions.id, { onDelete: 'cascade' }),
  position: integer('position').notNull(),
  // Carried into the next draft, so a step keeps its identity across versions (hold-point comparison).
  key: uuid('key').notNull(),
  text: text('text').notNull(),
  caution: text('caution'),
  holdPoint: boolean('hold_point').notNull(),
}, (t) => [
  uniqueIndex('procedure_steps_position_uq').on(t.versionId, t.position),
  uniqueIndex('procedure_steps_key_uq').on(t.versionId, t.key),
]);

export const procedureChecklists = pgTable('procedure_checklists', {
  id: uuid('id').primaryKey().defaultRandom(),
  versionId: uuid('version_id').notNull().references(() => procedureVersions.id, { onDelete: 'cascade' }),
  position: integer('position').notNull(),
  key: uuid('key').notNull(),
  kind: text('kind').notNull(),
  title: text('title').notNull(),
}, (t) => [
  uniqueIndex('procedure_checklists_position_uq').on(t.versionId, t.position),
  uniqueIndex('procedure_checklists_key_uq').on(t.versionId, t.key),
  check('procedure_checklists_kind_ck', sql`${t.kind} in ('self-sign-off', 'practical-assessment', 'bench-pre-use')`),
]);

export const checklistItems = pgTable('checklist_items', {
  id: uuid('id').primaryKey().defaultRandom(),
  checklistId: uuid('checklist_id').notNull().references(() => procedureChecklists.id, { onDelete: 'cascade' }),
  position: integer('position').notNull(),
  key: uuid('key').notNull(),
  kind: text('kind').notNull(),
  prompt: text('prompt').notNull(),
  guidance: text('guidance'),
  unit: text('unit'),
  // Validated against acceptanceRuleSchema (shared/schemas/checklists.ts) before it is stored.
  rule: jsonb('rule'),
  // The key of the step of the same version this item belongs to (null: no particular step).
  stepKey: uuid('step_key'),
}, (t) => [
  uniqueIndex('checklist_items_position_uq').on(t.checklistId, t.position),
  uniqueIndex('checklist_items_key_uq').on(t.checklistId, t.key),
  check('checklist_items_kind_ck', sql`${t.kind} in ('tick', 'text', 'evidence', 'measurement')`),
  check('checklist_items_measurement_ck', sql`(${t.kind} = 'measurement') = (${t.unit} is not null and ${t.rule} is not null)`),
  check('checklist_items_rule_type_ck', sql`${t.rule} is null or ${t.rule}->>'type' in ('range', 'preset', 'earth-continuity', 'computed')`),
]);
