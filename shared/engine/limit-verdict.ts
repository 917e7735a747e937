// Judging one measured value against a published limit preset.
import { EngineError } from './errors';
import type { LimitPreset, LimitSource } from './limits';

/** A reading: a number in the preset's unit, or "did not trip" for a trip-time test. */
export type LimitMeasurement = number | 'did-not-trip';

export interface LimitVerdict {
  presetId: string;
  measured: LimitMeasurement;
  unit: string;
  pass: boolean;
  /** Plain statement of the rule applied, e.g. "≤ 300 ms". */
  rule: string;
  source: LimitSource;
}

const isTime = (unit: LimitPreset['unit']) => unit === 'ms' || unit === 's';

/** The rule in plain words, as a checklist or the calculator shows it. */
export function limitRule(preset: LimitPreset): string {
  switch (preset.comparison) {
    case 'max':
      return `≤ ${preset.value} ${preset.unit}`;
    case 'min':
      return `≥ ${preset.value} ${preset.unit}`;
    case 'range':
      return `${preset.min} to ${preset.max} ${preset.unit}`;
    case 'no-trip':
      return `no trip within ${preset.testDurationMs} ms`;
  }
}

export function evaluateAgainstPreset(preset: LimitPreset, measured: LimitMeasurement): LimitVerdict {
  if (measured === 'did-not-trip' && !isTime(preset.unit)) {
    throw new EngineError('measured', `"did not trip" is not a reading for ${preset.label}: give a value in ${preset.unit}`);
  }
  // A device that did not trip has, in effect, an unbounded trip time.
  const x = measured === 'did-not-trip' ? Number.POSITIVE_INFINITY : measured;
  let pass: boolean;
  switch (preset.comparison) {
    case 'max':
      pass = x <= preset.value;
      break;
    case 'min':
      pass = x >= preset.value;
      break;
    case 'range':
      pass = x >= preset.min && x <= preset.max;
      break;
    case 'no-trip':
      pass = x >= preset.testDurationMs;
      break;
  }
  return { presetId: preset.id, measured, unit: preset.unit, pass, rule: limitRule(preset), source: preset.source };
}
