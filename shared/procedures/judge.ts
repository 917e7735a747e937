// Judging one measured value against a checklist item's acceptance rule, the same way on server and client.
import { earthContinuityPreset } from '../engine/earth-continuity.js';
import { evaluateAgainstPreset, findPreset, limitRule, type LimitMeasurement, type LimitSource } from '../engine/limits.js';
import type { AcceptanceRule } from '../schemas/checklists.js';
import { COMPUTED_QUANTITIES } from './quantities.js';

export interface Judgement {
  pass: boolean;
  /** The rule in plain words, e.g. "≤ 300 ms" or "230 V ± 5 %". */
  rule: string;
  source: LimitSource | null;
}

const fmt = (n: number) => String(Number(n.toPrecision(6)));

/**
 * `expected` is the engine's figure for a computed rule; without it a computed rule cannot be judged.
 * "did-not-trip" is a reading only for the trip-time presets (the engine refuses it elsewhere).
 */
export function judgeMeasurement(rule: AcceptanceRule, reading: LimitMeasurement, expected?: number): Judgement {
  if (rule.type === 'preset') {
    const preset = findPreset(rule.presetId);
    if (!preset) throw new Error(`unknown limit preset ${rule.presetId}`);
    const v = evaluateAgainstPreset(preset, reading);
    return { pass: v.pass, rule: v.rule, source: v.source };
  }
  if (reading === 'did-not-trip') throw new Error('"did not trip" is a reading only for a trip-time limit');
  const measured = reading;
  switch (rule.type) {
    case 'range': {
      const pass = (rule.min === undefined || measured >= rule.min) && (rule.max === undefined || measured <= rule.max);
      return { pass, rule: describeRule(rule), source: null };
    }
    case 'earth-continuity': {
      const v = evaluateAgainstPreset(earthContinuityPreset(rule.lengthM, rule.csaMm2), measured);
      return { pass: v.pass, rule: v.rule, source: v.source };
    }
    case 'computed': {
      if (expected === undefined || !Number.isFinite(expected)) throw new Error('a computed rule needs the expected value from the bench set-up');
      const band = rule.tolerance.mode === 'absolute' ? rule.tolerance.value : (Math.abs(expected) * rule.tolerance.percent) / 100;
      const unit = COMPUTED_QUANTITIES[rule.quantity].unit;
      const tol = rule.tolerance.mode === 'absolute' ? `${fmt(rule.tolerance.value)} ${unit}` : `${fmt(rule.tolerance.percent)} %`;
      // A hair of slack so a reading exactly on the band edge is not lost to floating-point rounding.
      return { pass: Math.abs(measured - expected) <= band * (1 + 1e-12), rule: `${fmt(expected)} ${unit} ± ${tol}`, source: null };
    }
  }
}

/** The rule as written on a checklist, before anything is measured. */
export function describeRule(rule: AcceptanceRule, unit = ''): string {
  const u = unit ? ` ${unit}` : '';
  switch (rule.type) {
    case 'range':
      if (rule.min !== undefined && rule.max !== undefined) return `${fmt(rule.min)} to ${fmt(rule.max)}${u}`;
      return rule.min !== undefined ? `≥ ${fmt(rule.min)}${u}` : `≤ ${fmt(rule.max!)}${u}`;
    case 'preset': {
      const p = findPreset(rule.presetId);
      return p ? `${p.label}: ${limitRule(p)} (${p.source.standard}; ${p.source.table})` : rule.presetId;
    }
    case 'earth-continuity': {
      const p = earthContinuityPreset(rule.lengthM, rule.csaMm2);
      return `${p.label}: ≤ ${fmt(p.value)} Ω (${p.source.standard})`;
    }
    case 'computed': {
      const q = COMPUTED_QUANTITIES[rule.quantity];
      const tol = rule.tolerance.mode === 'absolute' ? `± ${fmt(rule.tolerance.value)} ${q.unit}` : `± ${fmt(rule.tolerance.percent)} %`;
      return `${q.label} computed from the bench set-up, ${tol}`;
    }
  }
}
