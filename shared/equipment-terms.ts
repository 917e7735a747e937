// The fixed vocabularies of benches and test instruments, without zod, so client pages can use them cheaply.

// Phase-cut loads leak pulsating DC to earth, which can blind a Type AC RCD; Type A or better is needed.
export const RCD_TYPES = ['AC', 'A', 'F', 'B'] as const;
export type RcdType = (typeof RCD_TYPES)[number];

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
export type MeasurementCategory = (typeof MEASUREMENT_CATEGORIES)[number];
