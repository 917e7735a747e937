import { z } from 'zod';
import './messages.js';
import { line } from './text.js';
import { pageQuery, uuid } from './common.js';
import { activeFilter, calendarDate, equipmentFlag, notes } from './equipment-common.js';
import { INSTRUMENT_KINDS, MEASUREMENT_CATEGORIES } from '../equipment-terms.js';

export { INSTRUMENT_KINDS, INSTRUMENT_KIND_LABELS, MEASUREMENT_CATEGORIES, RMS_READING_KINDS, type InstrumentKind } from '../equipment-terms.js';

export const instrumentFields = z.object({
  siteId: uuid('choose a site'),
  kind: z.enum(INSTRUMENT_KINDS, { message: 'choose a kind' }),
  make: line().min(1, 'enter the make').max(80, 'use at most 80 characters'),
  model: line().min(1, 'enter the model').max(80, 'use at most 80 characters'),
  serial: line().min(1, 'enter the serial number').max(60, 'use at most 60 characters'),
  measurementCategory: z.enum(MEASUREMENT_CATEGORIES, { message: 'choose CAT II, III or IV, or none' }).nullable(),
  voltageRating: z.number().int('whole volts').min(1, 'at least 1 V').max(10_000, 'at most 10000 V').nullable(),
  trueRms: z.boolean(),
  calibrationDueOn: calendarDate,
  notes: notes.nullable(),
  active: z.boolean(),
});

interface Rating { measurementCategory: string | null; voltageRating: number | null }

/** A category means nothing without its voltage, and the other way round. */
export function instrumentRatingProblems(i: Rating): Record<string, string> {
  if (i.measurementCategory !== null && i.voltageRating === null) return { voltageRating: 'enter the voltage rating of the category' };
  if (i.measurementCategory === null && i.voltageRating !== null) return { measurementCategory: 'choose the category the voltage rating belongs to' };
  return {};
}

export const instrumentBody = instrumentFields
  .extend({ notes: notes.nullable().default(null), active: z.boolean().default(true) })
  .superRefine((b, ctx) => {
    for (const [path, message] of Object.entries(instrumentRatingProblems(b))) ctx.addIssue({ code: 'custom', path: [path], message });
  });
export const instrumentUpdateBody = instrumentFields.partial().strict();

export const instrumentsQuery = pageQuery.extend({
  siteId: uuid().optional(),
  kind: z.enum(INSTRUMENT_KINDS).optional(),
  active: activeFilter,
  calibration: z.enum(['expired', 'due']).optional(),
  sort: z.enum(['serial', 'kind', 'calibrationDueOn']).default('calibrationDueOn'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});

export const usabilityQuery = z.object({
  voltage: z.coerce.number({ message: 'give the circuit voltage in volts' }).int('whole volts').min(1, 'at least 1 V').max(10_000, 'at most 10000 V').optional(),
});

export const instrumentRow = instrumentFields.extend({
  id: z.string(),
  siteCode: z.string(),
  siteName: z.string(),
  timeZone: z.string(),
  flags: z.array(equipmentFlag),
  createdAt: z.string(),
  updatedAt: z.string(),
});

export type InstrumentBody = z.infer<typeof instrumentBody>;
export type InstrumentUpdateBody = z.infer<typeof instrumentUpdateBody>;
export type InstrumentsQuery = z.infer<typeof instrumentsQuery>;
export type InstrumentRow = z.infer<typeof instrumentRow>;
