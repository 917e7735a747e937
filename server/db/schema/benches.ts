import { sql } from 'drizzle-orm';
import { pgTable, uuid, text, boolean, integer, bigint, timestamp, date, index, uniqueIndex, check } from 'drizzle-orm/pg-core';
import { sites, users } from './core.js';

const ts = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

/** A bench and its fixed set-up: what supplies it and what protects the person at it. */
export const benches = pgTable('benches', {
  id: uuid('id').primaryKey().defaultRandom(),
  siteId: uuid('site_id').notNull().references(() => sites.id),
  code: text('code').notNull(),
  name: text('name').notNull(),
  supplyVoltage: integer('supply_voltage').notNull(),
  supplyFrequency: integer('supply_frequency').notNull(),
  isolatingTransformer: boolean('isolating_transformer').notNull(),
  isolatingTransformerVa: integer('isolating_transformer_va'),
  rcdType: text('rcd_type'),
  rcdRatedResidualMa: integer('rcd_rated_residual_ma'),
  emergencyStop: boolean('emergency_stop').notNull(),
  nextInspectionOn: date('next_inspection_on', { mode: 'string' }).notNull(),
  notes: text('notes'),
  active: boolean('active').notNull(),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
}, (t) => [
  uniqueIndex('benches_site_code_uq').on(t.siteId, t.code),
  index('benches_site_inspection_idx').on(t.siteId, t.nextInspectionOn),
  check('benches_supply_voltage_ck', sql`${t.supplyVoltage} between 1 and 1000`),
  check('benches_supply_frequency_ck', sql`${t.supplyFrequency} in (50, 60)`),
  check('benches_transformer_ck', sql`(${t.isolatingTransformer} and ${t.isolatingTransformerVa} > 0) or (not ${t.isolatingTransformer} and ${t.isolatingTransformerVa} is null)`),
  check('benches_rcd_ck', sql`(${t.rcdType} is null and ${t.rcdRatedResidualMa} is null) or (${t.rcdType} in ('AC', 'A', 'F', 'B') and ${t.rcdRatedResidualMa} > 0)`),
]);

/**
 * A manager's decision that a bench with a Type AC RCD may still be used for practicals on phase-cut
 * loads, with the reason (e.g. a Type A ahead of it). Never changed: the latest one for a bench stands.
 */
export const benchTypeAcDecisions = pgTable('bench_type_ac_decisions', {
  id: uuid('id').primaryKey().defaultRandom(),
  benchId: uuid('bench_id').notNull().references(() => benches.id),
  decidedBy: uuid('decided_by').notNull().references(() => users.id),
  decidedAt: ts('decided_at').notNull(),
  reason: text('reason').notNull(),
}, (t) => [
  index('bench_type_ac_decisions_bench_idx').on(t.benchId, t.decidedAt.desc()),
  check('bench_type_ac_decisions_reason_ck', sql`length(${t.reason}) >= 10`),
]);

/** A signed pre-use check of a bench; the checklist-driven kind links its checklist response. */
export const benchChecks = pgTable('bench_checks', {
  id: uuid('id').primaryKey().defaultRandom(),
  // Orders checks recorded at the same instant, so "the latest" is always one row.
  seq: bigint('seq', { mode: 'number' }).generatedAlwaysAsIdentity(),
  benchId: uuid('bench_id').notNull().references(() => benches.id),
  personId: uuid('person_id').notNull().references(() => users.id),
  at: ts('at').notNull(),
  passed: boolean('passed').notNull(),
  notes: text('notes'),
  checklistResponseId: uuid('checklist_response_id'),
}, (t) => [
  index('bench_checks_bench_latest_idx').on(t.benchId, t.at.desc(), t.seq.desc()),
  check('bench_checks_failed_notes_ck', sql`${t.passed} or ${t.notes} is not null`),
]);

/** A test instrument in use at a site, with its rating and calibration. */
export const instruments = pgTable('instruments', {
  id: uuid('id').primaryKey().defaultRandom(),
  siteId: uuid('site_id').notNull().references(() => sites.id),
  kind: text('kind').notNull(),
  make: text('make').notNull(),
  model: text('model').notNull(),
  serial: text('serial').notNull(),
  measurementCategory: text('measurement_category'),
  voltageRating: integer('voltage_rating'),
  trueRms: boolean('true_rms').notNull(),
  calibrationDueOn: date('calibration_due_on', { mode: 'string' }).notNull(),
  notes: text('notes'),
  active: boolean('active').notNull(),
  createdAt: ts('created_at').notNull(),
  updatedAt: ts('updated_at').notNull(),
}, (t) => [
  uniqueIndex('instruments_identity_uq').on(t.make, t.model, t.serial),
  index('instruments_site_calibration_idx').on(t.siteId, t.calibrationDueOn),
  index('instruments_serial_idx').on(t.serial),
  check('instruments_category_ck', sql`(${t.measurementCategory} is null and ${t.voltageRating} is null) or (${t.measurementCategory} in ('CAT II', 'CAT III', 'CAT IV') and ${t.voltageRating} > 0)`),
  check('instruments_kind_ck', sql`${t.kind} in ('multimeter', 'clamp_meter', 'insulation_tester', 'rcd_tester', 'multifunction_tester', 'earth_continuity_tester', 'oscilloscope', 'differential_probe', 'current_probe', 'voltage_detector', 'proving_unit', 'other')`),
]);
