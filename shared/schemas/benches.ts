import { z } from 'zod';
import './messages.js';
import { name } from './text.js';
import { pageQuery, uuid } from './common.js';
import { activeFilter, calendarDate, equipmentCode, equipmentFlag, notes } from './equipment-common.js';
import { RCD_TYPES } from '../equipment-terms.js';

export { RCD_TYPES, type RcdType } from '../equipment-terms.js';

export const benchFields = z.object({
  siteId: uuid('choose a site'),
  code: equipmentCode,
  name: name().min(2, 'enter a name').max(120, 'use at most 120 characters'),
  supplyVoltage: z.number().int('whole volts').min(1, 'between 1 and 1000 V').max(1000, 'between 1 and 1000 V'),
  supplyFrequency: z.union([z.literal(50), z.literal(60)], { message: 'choose 50 or 60 Hz' }),
  isolatingTransformer: z.boolean(),
  isolatingTransformerVa: z.number().int('whole VA').min(1, 'at least 1 VA').max(100_000).nullable(),
  rcdType: z.enum(RCD_TYPES, { message: 'choose AC, A, F or B, or none' }).nullable(),
  rcdRatedResidualMa: z.number().int('whole mA').min(1, 'at least 1 mA').max(1000, 'at most 1000 mA').nullable(),
  emergencyStop: z.boolean(),
  nextInspectionOn: calendarDate,
  notes: notes.nullable(),
  active: z.boolean(),
});

interface Setup { isolatingTransformer: boolean; isolatingTransformerVa: number | null; rcdType: string | null; rcdRatedResidualMa: number | null }

/** The pairs that go together: a transformer and its rating, an RCD and its rated residual current. */
export function benchSetupProblems(b: Setup): Record<string, string> {
  const p: Record<string, string> = {};
  if (b.isolatingTransformer && b.isolatingTransformerVa === null) p.isolatingTransformerVa = 'enter the transformer rating in VA';
  if (!b.isolatingTransformer && b.isolatingTransformerVa !== null) p.isolatingTransformerVa = 'leave empty when no transformer is fitted';
  if (b.rcdType !== null && b.rcdRatedResidualMa === null) p.rcdRatedResidualMa = 'enter the rated residual current in mA';
  if (b.rcdType === null && b.rcdRatedResidualMa !== null) p.rcdRatedResidualMa = 'leave empty when no RCD is fitted';
  return p;
}

function refineSetup(b: Setup, ctx: z.RefinementCtx) {
  for (const [path, message] of Object.entries(benchSetupProblems(b))) ctx.addIssue({ code: 'custom', path: [path], message });
}

export const benchBody = benchFields.extend({ notes: notes.nullable().default(null), active: z.boolean().default(true) }).superRefine(refineSetup);
// The site stays: a bench that moves is a new bench there. Pairs are checked against the stored row in the service.
export const benchUpdateBody = benchFields.omit({ siteId: true }).partial().strict();

export const benchesQuery = pageQuery.extend({
  siteId: uuid().optional(),
  active: activeFilter,
  inspection: z.enum(['overdue', 'due']).optional(),
  rcdType: z.enum(RCD_TYPES).optional(),
  sort: z.enum(['code', 'name', 'nextInspectionOn']).default('code'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});

export const preUseCheckBody = z
  .object({
    passed: z.boolean({ message: 'say whether the check passed' }),
    notes: notes.min(3, 'say what was found').nullable().default(null),
    password: z.string().max(1024).optional(),
  })
  .superRefine((b, ctx) => {
    if (!b.passed && !b.notes) ctx.addIssue({ code: 'custom', path: ['notes'], message: 'say what failed' });
  });

export const preUseCheck = z.object({
  id: z.string(),
  benchId: z.string(),
  personId: z.string(),
  personName: z.string(),
  at: z.string(),
  passed: z.boolean(),
  notes: z.string().nullable(),
  checklistResponseId: z.string().nullable(),
  signatures: z.array(z.object({ id: z.string(), signerId: z.string(), printedName: z.string(), meaning: z.string(), signedAt: z.string() })),
});

export const benchRow = benchFields.extend({
  id: z.string(),
  siteCode: z.string(),
  siteName: z.string(),
  timeZone: z.string(),
  latestCheck: z.object({ at: z.string(), passed: z.boolean(), notes: z.string().nullable() }).nullable(),
  flags: z.array(equipmentFlag),
  createdAt: z.string(),
  updatedAt: z.string(),
});

export type BenchBody = z.infer<typeof benchBody>;
export type BenchUpdateBody = z.infer<typeof benchUpdateBody>;
export type BenchesQuery = z.infer<typeof benchesQuery>;
export type PreUseCheckBody = z.infer<typeof preUseCheckBody>;
export type PreUseCheck = z.infer<typeof preUseCheck>;
export type BenchRow = z.infer<typeof benchRow>;
