// Judging one checklist entry, the same way on server (the authority) and client (the live verdict).
import type { LimitSource } from '../engine/limits.js';
import type { AcceptanceRule } from '../schemas/checklists.js';
import { describeRule, judgeMeasurement } from '../procedures/judge.js';
import { COMPUTED_QUANTITIES } from '../procedures/quantities.js';
import type { Expectations } from './expectations.js';

export const NO_EXPECTATION = 'no computed expectation — judged by the assessor';

const fmt = (n: number) => String(Number(n.toPrecision(4)));

/** The engine's figure for a computed rule, with its tolerance band in words; null when there is none. */
export function expectationOf(rule: AcceptanceRule | null, quantities: Expectations['quantities'] | null) {
  if (!rule || rule.type !== 'computed') return null;
  const unit = COMPUTED_QUANTITIES[rule.quantity].unit;
  const expected = quantities?.[rule.quantity];
  if (expected === undefined || !Number.isFinite(expected)) return { expected: null, tolerance: null, unit };
  const band = rule.tolerance.mode === 'absolute' ? rule.tolerance.value : (Math.abs(expected) * rule.tolerance.percent) / 100;
  const tolerance = rule.tolerance.mode === 'absolute' ? `± ${fmt(band)} ${unit}` : `± ${fmt(rule.tolerance.percent)} % (± ${fmt(band)} ${unit})`;
  return { expected, tolerance, unit, min: expected - band, max: expected + band };
}

export interface MeasurementJudgement {
  /** null: nothing could judge it (a computed rule without an expectation and no assessor's word yet). */
  verdict: 'pass' | 'fail' | null;
  judgedBy: 'rule' | 'assessor' | null;
  expected: number | null;
  tolerance: string | null;
  ruleText: string;
  source: LimitSource | null;
}

export function judgeReading(
  rule: AcceptanceRule,
  unit: string,
  reading: number | 'did-not-trip',
  quantities: Expectations['quantities'] | null,
  assessorVerdict?: 'pass' | 'fail',
): MeasurementJudgement {
  const exp = expectationOf(rule, quantities);
  if (exp && exp.expected === null) {
    const verdict = assessorVerdict ?? null;
    return { verdict, judgedBy: verdict ? 'assessor' : null, expected: null, tolerance: null, ruleText: `${describeRule(rule, unit)}: ${NO_EXPECTATION}`, source: null };
  }
  const j = judgeMeasurement(rule, reading, exp?.expected ?? undefined);
  return { verdict: j.pass ? 'pass' : 'fail', judgedBy: 'rule', expected: exp?.expected ?? null, tolerance: exp?.tolerance ?? null, ruleText: j.rule, source: j.source };
}

export interface StoredEntry {
  checked: boolean | null;
  text: string | null;
  evidenceId: string | null;
  value: number | null;
  didNotTrip: boolean | null;
  verdict: string | null;
}

/** Whether an item has what it needs: ticked, written, uploaded, or measured and passed (or left to the assessor). */
export function entryProblem(kind: string, e: StoredEntry | undefined, noExpectation: boolean): string | null {
  switch (kind) {
    case 'tick':
      return e?.checked ? null : 'not ticked';
    case 'text':
      return e?.text ? null : 'not answered';
    case 'evidence':
      return e?.evidenceId ? null : 'needs an upload';
    case 'measurement':
      if (!e || (e.value === null && !e.didNotTrip)) return 'not measured';
      if (e.verdict === 'fail') return 'the reading is outside the acceptance rule';
      return e.verdict === null && !noExpectation ? 'the reading has not been judged' : null;
    default:
      return 'unknown item kind';
  }
}
