import { z } from 'zod';
import { pageQuery } from './common.js';
import { activeFilter, calendarDate, equipmentFlag, notes } from './equipment-common.js';

export const INSTRUMENT_KINDS = [
  'multimeter', 'clamp_meter', 'insulation_tester', 'rcd_tester', 'multifunction_tester', 'earth_continuity_tester',
  'oscilloscope', 'differential_probe', 'current_probe', 'voltage_detector', 'proving_unit', 'other',
] as const;
export type InstrumentKind = (typeof INSTRUMENT_KINDS)[number];

export const INSTRUMENT_KIND_LABELS: Record<InstrumentKind, string> = {
  multimeter: 'Multimeter', clamp_meter: 'Clamp meter', insulation_tester: 'Insulation resistance tester', rcd_tester: 'RCD tester',
  multifunction_tester: 'Multifunction installation tester', earth_continuity_tester: 'Earth continuity tester', oscilloscope: 'Oscilloscope',
  differential_probe: 'Differential probe', current_probe: 'Current probe', voltage_detector: 'Two-pole voltage detector',
  proving_unit: 'Proving unit', other: 'Other',
};

/** Kinds whose reading depends on the waveform: an averaging one reads a phase-cut output wrongly. */
export const RMS_READING_KINDS: readonly InstrumentKind[] = ['multimeter', 'clamp_meter'];

// IEC 61010-1 measurement categories; no category means the inputs are not for mains circuits.
export const MEASUREMENT_CATEGORIES = ['CAT II', 'CAT III', 'CAT IV'] as const;

export const instrumentFields = z.object({
  siteId: z.uuid({ message: 'choose a site' }),
  kind: z.enum(INSTRUMENT_KINDS, { message: 'choose a kind' }),
  make: z.string().trim().min(1, 'enter the make').max(80, 'use at most 80 characters'),
  model: z.string().trim().min(1, 'enter the model').max(80, 'use at most 80 characters'),
  serial: z.string().trim().min(1, 'enter the serial number').max(60, 'use at most 60 characters'),
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
  siteId: z.uuid().optional(),
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
