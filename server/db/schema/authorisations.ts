import { sql } from 'drizzle-orm';
import {
  pgTable, uuid, text, integer, boolean, timestamp, date, jsonb, doublePrecision, index, uniqueIndex, unique, check, foreignKey, customType,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';
import { users } from './core.js';
import { signatures } from './signatures.js';
import { evidence } from './evidence.js';
import { procedures } from './procedures.js';

const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });
const dateStr = (name: string) => date(name, { mode: 'string' });
// Read and written only by the database (a generated column); the exclusion constraint is on it.
const tstzrange = customType<{ data: string; driverData: string }>({ dataType: () => 'tstzrange' });

/** What an authorisation lets a person do, within which limits, and what it rests on. */
export const scopes = pgTable('scopes', {
  id: uuid('id').primaryKey().defaultRandom(),
  code: text('code').notNull(),
  title: text('title').notNull(),
  description: text('description').notNull(),
  maxVoltageV: integer('max_voltage_v').notNull(),
  maxCurrentA: doublePrecision('max_current_a').notNull(),
  allowsLiveWork: boolean('allows_live_work').notNull(),
  validityMonths: integer('validity_months').notNull(),
  reminderOffsetsDays: integer('reminder_offsets_days').array().notNull(),
  certificateGraceDays: integer('certificate_grace_days').notNull(),
  active: boolean('active').notNull(),
  createdBy: uuid('created_by').references(() => users.id),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
  /** The updated_at the sweep last re-decided everyone it concerns for (null: not yet). */
  redecidedAt: ts('redecided_at'),
}, (t) => [
  uniqueIndex('scopes_code_uq').on(t.code),
  check('scopes_code_ck', sql`${t.code} ~ '^[A-Z0-9][A-Z0-9-]{1,23}$'`),
  check('scopes_limits_ck', sql`${t.maxVoltageV} between 1 and 1000 and ${t.maxCurrentA} > 0 and ${t.maxCurrentA} <= 100`),
  check('scopes_validity_ck', sql`${t.validityMonths} between 1 and 60`),
  check('scopes_grace_ck', sql`${t.certificateGraceDays} between 0 and 90`),
  check('scopes_offsets_ck', sql`cardinality(${t.reminderOffsetsDays}) <= 6 and 1 <= all(${t.reminderOffsetsDays}) and 365 >= all(${t.reminderOffsetsDays})`),
]);

/** One line of what a scope requires; the parameters used depend on the kind. */
export const scopeRequirements = pgTable('scope_requirements', {
  id: uuid('id').primaryKey().defaultRandom(),
  scopeId: uuid('scope_id').notNull().references(() => scopes.id, { onDelete: 'cascade' }),
  position: integer('position').notNull(),
  kind: text('kind').notNull(),
  procedureId: uuid('procedure_id').references(() => procedures.id),
  prerequisiteScopeId: uuid('prerequisite_scope_id').references((): AnyPgColumn => scopes.id),
  certificateKind: text('certificate_kind'),
  practicalsCount: integer('practicals_count'),
  practicalsWindowMonths: integer('practicals_window_months'),
}, (t) => [
  uniqueIndex('scope_requirements_position_uq').on(t.scopeId, t.position),
  index('scope_requirements_prerequisite_idx').on(t.prerequisiteScopeId),
  index('scope_requirements_procedure_idx').on(t.procedureId),
  check('scope_requirements_kind_ck', sql`${t.kind} in ('procedure_ack', 'checklist_signoff', 'practicals', 'prerequisite', 'certificate')`),
  check('scope_requirements_params_ck', sql`case ${t.kind}
    when 'procedure_ack' then ${t.procedureId} is not null
    when 'checklist_signoff' then ${t.procedureId} is not null
    when 'practicals' then ${t.procedureId} is not null and ${t.practicalsCount} >= 1 and ${t.practicalsWindowMonths} >= 1
    when 'prerequisite' then ${t.prerequisiteScopeId} is not null and ${t.prerequisiteScopeId} <> ${t.scopeId}
    when 'certificate' then ${t.certificateKind} is not null end`),
]);

/** First aid, CPR and the like: uploaded by the holder, checked by a manager, with an expiry of their own. */
export const externalCertificates = pgTable('external_certificates', {
  id: uuid('id').primaryKey().defaultRandom(),
  holderId: uuid('holder_id').notNull().references(() => users.id),
  kind: text('kind').notNull(),
  issuer: text('issuer').notNull(),
  reference: text('reference').notNull(),
  issuedOn: dateStr('issued_on').notNull(),
  expiresOn: dateStr('expires_on').notNull(),
  // The end of the expiry day in the holder's site time zone.
  validUntil: ts('valid_until').notNull(),
  evidenceId: uuid('evidence_id').references(() => evidence.id),
  status: text('status').notNull(),
  submittedBy: uuid('submitted_by').notNull().references(() => users.id),
  submittedAt: ts('submitted_at').notNull(),
  reviewedBy: uuid('reviewed_by').references(() => users.id),
  reviewedAt: ts('reviewed_at'),
  signatureId: uuid('signature_id').references(() => signatures.id),
  rejectionReason: text('rejection_reason'),
  // How the checking manager saw it: 'scan' on file, or 'original_seen' in person (where and on which day).
  // Null on checks recorded before this was asked.
  checkedHow: text('checked_how'),
  originalSeenWhere: text('original_seen_where'),
  originalSeenOn: dateStr('original_seen_on'),
}, (t) => [
  check('external_certificates_checked_how_ck', sql`${t.checkedHow} is null or (${t.checkedHow} = 'scan' and ${t.originalSeenWhere} is null) or (${t.checkedHow} = 'original_seen' and ${t.originalSeenWhere} is not null and ${t.originalSeenOn} is not null)`),
  index('external_certificates_holder_idx').on(t.holderId, t.kind, t.validUntil),
  index('external_certificates_valid_until_idx').on(t.validUntil).where(sql`${t.status} = 'verified'`),
  index('external_certificates_submitted_idx').on(t.submittedAt).where(sql`${t.status} = 'submitted'`),
  check('external_certificates_kind_ck', sql`${t.kind} in ('first_aid_cpr', 'first_aid', 'cpr_aed', 'release_from_live_parts', 'electrical_qualification')`),
  check('external_certificates_status_ck', sql`${t.status} in ('submitted', 'verified', 'rejected')`),
  check('external_certificates_dates_ck', sql`${t.expiresOn} > ${t.issuedOn}`),
  check('external_certificates_verified_ck', sql`${t.status} <> 'verified' or (${t.reviewedBy} is not null and ${t.signatureId} is not null and ${t.reviewedBy} <> ${t.holderId})`),
  check('external_certificates_rejected_ck', sql`${t.status} <> 'rejected' or (${t.reviewedBy} is not null and length(${t.rejectionReason}) >= 3)`),
]);

/** A person's standing on one scope; its periods and their events say what it was at any moment. */
export const authorisations = pgTable('authorisations', {
  id: uuid('id').primaryKey().defaultRandom(),
  holderId: uuid('holder_id').notNull().references(() => users.id),
  scopeId: uuid('scope_id').notNull().references(() => scopes.id),
  createdAt: ts('created_at').notNull(),
}, (t) => [
  uniqueIndex('authorisations_holder_scope_uq').on(t.holderId, t.scopeId),
  // The target of the periods' composite key, so a period's holder and scope always match its authorisation.
  unique('authorisations_id_holder_scope_uq').on(t.id, t.holderId, t.scopeId),
  index('authorisations_scope_idx').on(t.scopeId),
]);

/**
 * One stretch of time an authorisation runs, [starts_at, ends_at). ends_at moves earlier when what it rests
 * on runs out first, and is cut short by a renewal, a revocation or the holder leaving. An exclusion
 * constraint on `during` (see the guards migration) keeps one person's periods of one scope apart.
 */
export const authorisationPeriods = pgTable('authorisation_periods', {
  id: uuid('id').primaryKey().defaultRandom(),
  authorisationId: uuid('authorisation_id').notNull(),
  holderId: uuid('holder_id').notNull(),
  scopeId: uuid('scope_id').notNull(),
  startsAt: ts('starts_at').notNull(),
  endsAt: ts('ends_at').notNull(),
  // The latest the period may run: its validity from the start (or the paper record's expiry).
  validityEndsAt: ts('validity_ends_at').notNull(),
  during: tstzrange('during').notNull().generatedAlwaysAs(sql`tstzrange("starts_at", "ends_at", '[)')`),
  origin: text('origin').notNull(),
  previousPeriodId: uuid('previous_period_id').references((): AnyPgColumn => authorisationPeriods.id),
  verificationCode: text('verification_code').notNull(),
  evidenceSnapshot: jsonb('evidence_snapshot').notNull(),
  issuedBy: uuid('issued_by').references(() => users.id),
  attestedBy: text('attested_by'),
  priorEvidenceId: uuid('prior_evidence_id').references(() => evidence.id),
  priorNote: text('prior_note'),
  recordedAt: ts('recorded_at').notNull(),
}, (t) => [
  foreignKey({ columns: [t.authorisationId, t.holderId, t.scopeId], foreignColumns: [authorisations.id, authorisations.holderId, authorisations.scopeId], name: 'authorisation_periods_authorisation_fk' }),
  uniqueIndex('authorisation_periods_code_uq').on(t.verificationCode),
  index('authorisation_periods_latest_idx').on(t.authorisationId, t.startsAt),
  index('authorisation_periods_holder_idx').on(t.holderId, t.scopeId, t.startsAt),
  index('authorisation_periods_ends_idx').on(t.endsAt),
  check('authorisation_periods_order_ck', sql`${t.endsAt} >= ${t.startsAt} and ${t.validityEndsAt} > ${t.startsAt} and ${t.endsAt} <= ${t.validityEndsAt}`),
  check('authorisation_periods_origin_ck', sql`${t.origin} in ('issued', 'renewed', 'prior', 'imported')`),
  check('authorisation_periods_code_ck', sql`${t.verificationCode} ~ '^[A-Z2-7]{32}$'`),
  check('authorisation_periods_prior_ck', sql`(${t.origin} in ('prior', 'imported')) = (${t.attestedBy} is not null)`),
  check('authorisation_periods_renewed_ck', sql`(${t.origin} = 'renewed') = (${t.previousPeriodId} is not null)`),
]);

/** What happened to a period: when it takes effect and when it was recorded, by whom, why, and the signature. */
export const authorisationEvents = pgTable('authorisation_events', {
  id: uuid('id').primaryKey().defaultRandom(),
  periodId: uuid('period_id').notNull().references(() => authorisationPeriods.id),
  kind: text('kind').notNull(),
  effectiveAt: ts('effective_at').notNull(),
  recordedAt: ts('recorded_at').notNull(),
  // Null when the server itself decided (issue on the completing event, lapse, a cascade).
  actorId: uuid('actor_id').references(() => users.id),
  reason: text('reason'),
  // What a suspension hangs on: 'manual', 'prerequisite:<scope id>' or 'certificate:<kind>'.
  cause: text('cause'),
  signatureId: uuid('signature_id').references(() => signatures.id),
  details: jsonb('details'),
}, (t) => [
  index('authorisation_events_period_idx').on(t.periodId, t.effectiveAt),
  index('authorisation_events_kind_idx').on(t.kind, t.effectiveAt),
  check('authorisation_events_kind_ck', sql`${t.kind} in ('issued', 'renewed', 'suspended', 'reinstated', 'revoked', 'lapsed', 'renewal_submitted', 'restored', 'ended')`),
  check('authorisation_events_cause_ck', sql`(${t.kind} in ('suspended', 'reinstated', 'renewal_submitted', 'restored')) = (${t.cause} is not null)`),
  check('authorisation_events_reason_ck', sql`${t.kind} not in ('suspended', 'reinstated', 'revoked', 'lapsed', 'ended') or length(${t.reason}) >= 3`),
  check('authorisation_events_signed_ck', sql`not (${t.kind} = 'revoked' or ${t.cause} = 'manual') or (${t.actorId} is not null and ${t.signatureId} is not null)`),
]);

/**
 * One reminder or lapse notice per (period or certificate, offset in days, recipient, due moment): the
 * unique key is what makes a send happen once however many workers sweep. The due moment is the end
 * less the offset, so when an end moves (a certificate it rests on runs out sooner, or is renewed) the
 * offsets are reminded again for the new end, and once only. Pending rows are retried with back-off.
 */
export const reminderSends = pgTable('reminder_sends', {
  id: uuid('id').primaryKey().defaultRandom(),
  periodId: uuid('period_id').references(() => authorisationPeriods.id),
  certificateId: uuid('certificate_id').references(() => externalCertificates.id),
  // 0 is the notice that it has lapsed.
  offsetDays: integer('offset_days').notNull(),
  recipientId: uuid('recipient_id').notNull().references(() => users.id),
  recipientRole: text('recipient_role').notNull(),
  dueAt: ts('due_at').notNull(),
  status: text('status').notNull(),
  attempts: integer('attempts').notNull(),
  nextAttemptAt: ts('next_attempt_at').notNull(),
  lastError: text('last_error'),
  sentAt: ts('sent_at'),
  mailId: uuid('mail_id'),
  createdAt: ts('created_at').notNull(),
}, (t) => [
  uniqueIndex('reminder_sends_once_uq').on(sql`coalesce(${t.periodId}, ${t.certificateId})`, t.offsetDays, t.recipientId, t.dueAt),
  index('reminder_sends_pending_idx').on(t.nextAttemptAt).where(sql`${t.status} = 'pending'`),
  index('reminder_sends_recipient_idx').on(t.recipientId, t.createdAt),
  check('reminder_sends_subject_ck', sql`num_nonnulls(${t.periodId}, ${t.certificateId}) = 1`),
  check('reminder_sends_status_ck', sql`${t.status} in ('pending', 'sent', 'cancelled')`),
  check('reminder_sends_role_ck', sql`${t.recipientRole} in ('holder', 'manager')`),
  check('reminder_sends_offset_ck', sql`${t.offsetDays} between 0 and 365`),
  check('reminder_sends_sent_ck', sql`(${t.status} = 'sent') = (${t.sentAt} is not null)`),
]);
