// Published acceptance limits used as checklist presets. Values marked "from memory" were recalled, not read from the standard.

export interface LimitSource {
  standard: string;
  edition: string;
  table: string;
}

export type LimitPreset = {
  id: string;
  label: string;
  unit: 'ms' | 's' | 'mA' | 'MΩ' | 'Ω';
  source: LimitSource;
  note: string;
} & (
  | { comparison: 'max'; value: number }
  | { comparison: 'min'; value: number }
  | { comparison: 'range'; min: number; max: number }
  /** The device must hold for the whole test: a pass is "did not trip" or a trip time at or beyond the test duration. */
  | { comparison: 'no-trip'; testDurationMs: number }
);

const RCD_SOURCE: LimitSource = {
  standard: 'IEC 61008-1 (RCCB) / IEC 61009-1 (RCBO)',
  edition: 'IEC 61008-1:2010 and IEC 61009-1:2010 (Ed. 3.0), from memory',
  table: 'Table 1: limit values of break time and non-actuating time, general (non-delay) type, from memory',
};
const RCD_NOTE =
  'General (non-delay) 30 mA device, AC test current. Phase-cut loads leak pulsating DC, so the bench RCD must be Type A or better (Type F or B).';

const rcd = (id: string, multiple: number, ms: number): LimitPreset => ({
  id,
  label: `RCD 30 mA break time at ${multiple}×IΔn (${30 * multiple} mA)`,
  unit: 'ms',
  comparison: 'max',
  value: ms,
  source: RCD_SOURCE,
  note: RCD_NOTE,
});

const INSTALLATION: LimitSource = {
  standard: 'IEC 60364-6 / BS 7671',
  edition: 'IEC 60364-6:2016 (Ed. 2.0); BS 7671:2018+A2:2022',
  table: 'IEC 60364-6 Table 6.1; BS 7671 Table 64',
};
const IN_SERVICE: LimitSource = {
  standard: 'IET Code of Practice for In-service Inspection and Testing of Electrical Equipment',
  edition: '5th edition (2020), from memory',
  table: 'Insulation resistance minimum values by equipment class (table number not in hand)',
};

/** Common practice, from memory: the 0.5×IΔn current is applied for at least the 1×IΔn break time. */
export const HALF_RATED_TEST_MS = 300;

export const LIMIT_PRESETS: readonly LimitPreset[] = [
  rcd('rcd-30ma-1x', 1, 300),
  rcd('rcd-30ma-2x', 2, 150),
  rcd('rcd-30ma-5x', 5, 40),
  {
    id: 'rcd-30ma-half',
    label: 'RCD 30 mA at 0.5×IΔn (15 mA): must not trip',
    unit: 'ms',
    comparison: 'no-trip',
    testDurationMs: HALF_RATED_TEST_MS,
    source: RCD_SOURCE,
    note: `Record "did not trip", or the trip time if it tripped; a trip before ${HALF_RATED_TEST_MS} ms fails. ${RCD_NOTE}`,
  },
  {
    id: 'gfci-class-a-trip-current',
    label: 'GFCI (Class A, 120 V personnel protection) trip current',
    unit: 'mA',
    comparison: 'range',
    min: 4,
    max: 6,
    source: { standard: 'UL 943', edition: 'current edition, from memory', table: 'Class A trip threshold (nominal 4–6 mA), from memory' },
    note: 'Must trip at 6 mA and above; must not trip below 4 mA.',
  },
  ...(
    [
      ['selv-pelv', 'SELV and PELV circuits (250 V DC test)', 0.5],
      ['up-to-500v', 'Circuits up to and including 500 V (500 V DC test)', 1],
      ['above-500v', 'Circuits above 500 V (1000 V DC test)', 1],
    ] as const
  ).map(([id, what, min]): LimitPreset => ({
    id: `insulation-installation-${id}`,
    label: `Installation insulation resistance: ${what}`,
    unit: 'MΩ',
    comparison: 'min',
    value: min,
    source: INSTALLATION,
    note: 'Fixed installation circuits, not equipment: use the in-service presets for appliances.',
  })),
  ...(
    [
      ['class-i', 'Class I', 1],
      ['class-ii', 'Class II', 2],
    ] as const
  ).map(([id, cls, min]): LimitPreset => ({
    id: `insulation-equipment-${id}`,
    label: `In-service equipment insulation resistance: ${cls} (500 V DC test)`,
    unit: 'MΩ',
    comparison: 'min',
    value: min,
    source: IN_SERVICE,
    note: 'Equipment in service, by protection class; not the installation limits.',
  })),
];

export function findPreset(id: string): LimitPreset | undefined {
  return LIMIT_PRESETS.find((p) => p.id === id);
}

/** UL 943 (from memory): maximum trip time T = (20 / I)^1.43 s, I in mA, from 6 mA; no longer than 25 ms above 264 mA. */
export const GFCI_TRIP_TIME = { exponent: 1.43, constantMa: 20, fromMa: 6, floorAboveMa: 264, floorS: 0.025 } as const;

export function gfciMaxTripTimeS(currentMa: number): number | null {
  const g = GFCI_TRIP_TIME;
  if (!(currentMa >= g.fromMa)) return null; // below the trip threshold the device need not trip
  if (currentMa > g.floorAboveMa) return g.floorS;
  return (g.constantMa / currentMa) ** g.exponent;
}

// Kept reachable from here: checklist judging imports it from this module.
export { evaluateAgainstPreset, limitRule, type LimitMeasurement, type LimitVerdict } from './limit-verdict';
