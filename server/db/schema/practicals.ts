import { sql } from 'drizzle-orm';
import { pgTable, uuid, text, integer, boolean, timestamp, jsonb, doublePrecision, index, uniqueIndex, check, type AnyPgColumn } from 'drizzle-orm/pg-core';
import { sites, users } from './core.js';
import { signatures } from './signatures.js';
import { benches, benchTypeAcDecisions, instruments } from './benches.js';
import { evidence } from './evidence.js';
import { checklistItems, procedureChecklists, procedures, procedureVersions } from './procedures.js';
import { scopes } from './authorisations.js';

const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

// The columns of one checklist entry, the same for a sign-off and a practical (see shared/practicals/entries.ts).
const entryColumns = () => ({
  itemId: uuid('item_id').notNull().references(() => checklistItems.id),
  kind: text('kind').notNull(),
  checked: boolean('checked'),
  text: text('text'),
  evidenceId: uuid('evidence_id').references(() => evidence.id),
  value: doublePrecision('value'),
  didNotTrip: boolean('did_not_trip').notNull().default(false),
  unit: text('unit'),
  instrumentId: uuid('instrument_id').references(() => instruments.id),
  expected: doublePrecision('expected'),
  tolerance: text('tolerance'),
  verdict: text('verdict'),
  judgedBy: text('judged_by'),
  ruleText: text('rule_text'),
  source: jsonb('source'),
  note: text('note'),
  recordedAt: ts('recorded_at').notNull(),
  recordedBy: uuid('recorded_by').notNull().references(() => users.id),
});
const entryChecks = (name: string, t: { kind: any; verdict: any; judgedBy: any; value: any; didNotTrip: any; unit: any }) => [
  check(`${name}_kind_ck`, sql`${t.kind} in ('tick', 'text', 'evidence', 'measurement')`),
  check(`${name}_verdict_ck`, sql`(${t.verdict} is null or ${t.verdict} in ('pass', 'fail')) and (${t.judgedBy} is null or ${t.judgedBy} in ('rule', 'assessor'))`),
  check(`${name}_measured_ck`, sql`${t.kind} <> 'measurement' or ((${t.value} is not null) <> ${t.didNotTrip} and ${t.unit} is not null)`),
];

/** A checklist filled in by the person it is about: a self sign-off, or a bench pre-use check. */
export const signoffs = pgTable('signoffs', {
  id: uuid('id').primaryKey().defaultRandom(),
  kind: text('kind').notNull(),
  personId: uuid('person_id').notNull().references(() => users.id),
  siteId: uuid('site_id').notNull().references(() => sites.id),
  procedureId: uuid('procedure_id').notNull().references(() => procedures.id),
  versionId: uuid('version_id').notNull().references(() => procedureVersions.id),
  checklistId: uuid('checklist_id').notNull().references(() => procedureChecklists.id),
  benchId: uuid('bench_id').references(() => benches.id),
  status: text('status').notNull(),
  correctsId: uuid('corrects_id').references((): AnyPgColumn => signoffs.id),
  correctionReason: text('correction_reason'),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
  submittedAt: ts('submitted_at'),
  submitSignatureId: uuid('submit_signature_id').references(() => signatures.id),
  passed: boolean('passed'),
  notes: text('notes'),
  benchCheckId: uuid('bench_check_id'),
  reviewedBy: uuid('reviewed_by').references(() => users.id),
  reviewedAt: ts('reviewed_at'),
  reviewSignatureId: uuid('review_signature_id').references(() => signatures.id),
  returnComment: text('return_comment'),
}, (t) => [
  index('signoffs_person_idx').on(t.personId, t.updatedAt),
  index('signoffs_site_idx').on(t.siteId, t.status, t.updatedAt),
  index('signoffs_pending_idx').on(t.siteId, t.submittedAt).where(sql`${t.status} = 'submitted'`),
  uniqueIndex('signoffs_corrects_uq').on(t.correctsId),
  check('signoffs_kind_ck', sql`${t.kind} in ('self-sign-off', 'bench-pre-use')`),
  check('signoffs_status_ck', sql`${t.status} in ('in_progress', 'submitted', 'countersigned', 'returned', 'recorded')`),
  check('signoffs_bench_ck', sql`(${t.kind} = 'bench-pre-use') = (${t.benchId} is not null)`),
  check('signoffs_recorded_ck', sql`(${t.status} = 'recorded') = (${t.kind} = 'bench-pre-use' and ${t.status} <> 'in_progress') and (${t.status} <> 'recorded' or (${t.passed} is not null and ${t.benchCheckId} is not null))`),
  check('signoffs_signed_ck', sql`${t.status} = 'in_progress' or (${t.submittedAt} is not null and ${t.submitSignatureId} is not null)`),
  check('signoffs_reviewed_ck', sql`${t.status} not in ('countersigned', 'returned') or (${t.reviewedBy} is not null and ${t.reviewedAt} is not null and ${t.reviewedBy} <> ${t.personId})`),
  check('signoffs_countersigned_ck', sql`${t.status} <> 'countersigned' or ${t.reviewSignatureId} is not null`),
  check('signoffs_returned_ck', sql`${t.status} <> 'returned' or length(${t.returnComment}) >= 3`),
  check('signoffs_correction_ck', sql`(${t.correctsId} is null) = (${t.correctionReason} is null) and ${t.correctsId} is distinct from ${t.id}`),
]);

export const signoffEntries = pgTable('signoff_entries', {
  id: uuid('id').primaryKey().defaultRandom(),
  signoffId: uuid('signoff_id').notNull().references(() => signoffs.id),
  ...entryColumns(),
}, (t) => [uniqueIndex('signoff_entries_item_uq').on(t.signoffId, t.itemId), ...entryChecks('signoff_entries', t)]);

/** A supervised practical: an assessor watches a technician do the job on a bench and records what was measured. */
export const practicals = pgTable('practicals', {
  id: uuid('id').primaryKey().defaultRandom(),
  technicianId: uuid('technician_id').notNull().references(() => users.id),
  assessorId: uuid('assessor_id').notNull().references(() => users.id),
  siteId: uuid('site_id').notNull().references(() => sites.id),
  benchId: uuid('bench_id').notNull().references(() => benches.id),
  procedureId: uuid('procedure_id').notNull().references(() => procedures.id),
  versionId: uuid('version_id').notNull().references(() => procedureVersions.id),
  checklistId: uuid('checklist_id').notNull().references(() => procedureChecklists.id),
  scopeId: uuid('scope_id').references(() => scopes.id),
  instrumentIds: uuid('instrument_ids').array().notNull(),
  // Validated against circuitSchema; the expectations were computed from it by the engine when opened.
  circuit: jsonb('circuit').notNull(),
  expectations: jsonb('expectations').notNull(),
  status: text('status').notNull(),
  outcome: text('outcome'),
  outcomeComment: text('outcome_comment'),
  // When the practical took place (a correction keeps the original's).
  heldAt: ts('held_at').notNull(),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
  assessedAt: ts('assessed_at'),
  assessorSignatureId: uuid('assessor_signature_id').references(() => signatures.id),
  acknowledgedAt: ts('acknowledged_at'),
  technicianSignatureId: uuid('technician_signature_id').references(() => signatures.id),
  correctsId: uuid('corrects_id').references((): AnyPgColumn => practicals.id),
  correctionReason: text('correction_reason'),
  // Why a technician works on a bench of another site than their own (required then).
  crossSiteReason: text('cross_site_reason'),
  // The manager's decision that allowed a Type AC bench, when the bench had one.
  typeAcDecisionId: uuid('type_ac_decision_id').references(() => benchTypeAcDecisions.id),
}, (t) => [
  index('practicals_technician_idx').on(t.technicianId, t.heldAt),
  index('practicals_assessor_idx').on(t.assessorId, t.heldAt),
  index('practicals_site_idx').on(t.siteId, t.status, t.heldAt),
  index('practicals_bench_idx').on(t.benchId, t.heldAt),
  uniqueIndex('practicals_corrects_uq').on(t.correctsId),
  check('practicals_not_self_ck', sql`${t.technicianId} <> ${t.assessorId}`),
  check('practicals_status_ck', sql`${t.status} in ('in_progress', 'assessed', 'acknowledged')`),
  check('practicals_outcome_ck', sql`${t.outcome} is null or ${t.outcome} in ('competent', 'not_yet_competent')`),
  check('practicals_assessed_ck', sql`${t.status} = 'in_progress' or (${t.outcome} is not null and length(${t.outcomeComment}) >= 3 and ${t.assessedAt} is not null and ${t.assessorSignatureId} is not null)`),
  check('practicals_acknowledged_ck', sql`(${t.status} = 'acknowledged') = (${t.technicianSignatureId} is not null and ${t.acknowledgedAt} is not null)`),
  check('practicals_correction_ck', sql`(${t.correctsId} is null) = (${t.correctionReason} is null) and ${t.correctsId} is distinct from ${t.id}`),
]);

export const practicalEntries = pgTable('practical_entries', {
  id: uuid('id').primaryKey().defaultRandom(),
  practicalId: uuid('practical_id').notNull().references(() => practicals.id),
  ...entryColumns(),
  // The order things were done in at the bench, counted across entries and hold points of the practical.
  seq: integer('seq'),
}, (t) => [
  uniqueIndex('practical_entries_item_uq').on(t.practicalId, t.itemId),
  ...entryChecks('practical_entries', t),
  check('practical_entries_instrument_ck', sql`${t.kind} <> 'measurement' or ${t.instrumentId} is not null`),
]);

/** A hold point of the procedure witnessed by the assessor; the guards migration keeps them in procedure order. */
export const practicalHoldPoints = pgTable('practical_hold_points', {
  id: uuid('id').primaryKey().defaultRandom(),
  practicalId: uuid('practical_id').notNull().references(() => practicals.id),
  stepKey: uuid('step_key').notNull(),
  position: integer('position').notNull(),
  witnessedAt: ts('witnessed_at').notNull(),
  witnessedBy: uuid('witnessed_by').notNull().references(() => users.id),
  note: text('note'),
  seq: integer('seq'),
}, (t) => [
  uniqueIndex('practical_hold_points_step_uq').on(t.practicalId, t.stepKey),
  uniqueIndex('practical_hold_points_position_uq').on(t.practicalId, t.position),
]);

/** Every reading taken for a measurement item of a practical, in order: a re-recorded one stays, with the reason. */
export const practicalAttempts = pgTable('practical_attempts', {
  id: uuid('id').primaryKey().defaultRandom(),
  practicalId: uuid('practical_id').notNull().references(() => practicals.id),
  itemId: uuid('item_id').notNull().references(() => checklistItems.id),
  seq: integer('seq').notNull(),
  value: doublePrecision('value'),
  didNotTrip: boolean('did_not_trip').notNull(),
  unit: text('unit').notNull(),
  instrumentId: uuid('instrument_id').notNull().references(() => instruments.id),
  expected: doublePrecision('expected'),
  tolerance: text('tolerance'),
  verdict: text('verdict'),
  judgedBy: text('judged_by'),
  // Why it was taken again; null for the first attempt.
  reason: text('reason'),
  recordedAt: ts('recorded_at').notNull(),
  recordedBy: uuid('recorded_by').notNull().references(() => users.id),
}, (t) => [
  uniqueIndex('practical_attempts_seq_uq').on(t.practicalId, t.seq),
  index('practical_attempts_item_idx').on(t.practicalId, t.itemId, t.seq),
  check('practical_attempts_verdict_ck', sql`${t.verdict} is null or ${t.verdict} in ('pass', 'fail')`),
  check('practical_attempts_value_ck', sql`(${t.value} is not null) <> ${t.didNotTrip}`),
]);
