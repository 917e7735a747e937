import { describe, it, expect } from 'vitest';
import { describeRule, judgeMeasurement } from '../../../shared/procedures/judge.js';
import { acceptanceRuleSchema, checklistItemSchema } from '../../../shared/schemas/checklists.js';
import { addDays, addMonths } from '../../../shared/procedures/dates.js';

describe('acceptance rules', () => {
  it('when a fixed range is given, then both ends are inclusive', () => {
    const rule = { type: 'range' as const, min: 207, max: 253 };
    expect(judgeMeasurement(rule, 207).pass).toBe(true);
    expect(judgeMeasurement(rule, 253.1).pass).toBe(false);
    expect(describeRule(rule, 'V')).toBe('207 to 253 V');
    expect(describeRule({ type: 'range', max: 0.5 }, 'Ω')).toBe('≤ 0.5 Ω');
  });

  it('when a preset is used, then the engine judges it and names the source', () => {
    // IEC 61008-1 Table 1 (from memory, as the engine's preset says): 300 ms at 1×IΔn.
    const v = judgeMeasurement({ type: 'preset', presetId: 'rcd-30ma-1x' }, 28);
    expect(v).toMatchObject({ pass: true, rule: '≤ 300 ms' });
    expect(v.source?.standard).toMatch(/IEC 61008-1/);
    expect(judgeMeasurement({ type: 'preset', presetId: 'rcd-30ma-1x' }, 'did-not-trip').pass).toBe(false);
    expect(() => judgeMeasurement({ type: 'range', min: 1 }, 'did-not-trip')).toThrow(/trip-time/);
  });

  it('when an expected value comes from the engine, then the tolerance is absolute or relative to it', () => {
    const rel = { type: 'computed' as const, quantity: 'output-rms-voltage' as const, tolerance: { mode: 'relative' as const, percent: 5 } };
    // 230 V at α = 90°: 230·√(1 − 1/2 + 0) = 162.63 V, the single-phase AC voltage controller formula (Rashid, Power Electronics, 4th ed., ch. 11).
    expect(judgeMeasurement(rel, 170.7, 162.63).pass).toBe(true);
    expect(judgeMeasurement(rel, 171, 162.63).pass).toBe(false);
    const abs = { type: 'computed' as const, quantity: 'firing-angle' as const, tolerance: { mode: 'absolute' as const, value: 5 } };
    expect(judgeMeasurement(abs, 95, 90)).toMatchObject({ pass: true, rule: '90 ° ± 5 °' });
    expect(() => judgeMeasurement(abs, 95)).toThrow(/expected value/);
  });

  it('when an item is malformed, then the schema names the field', () => {
    expect(acceptanceRuleSchema.safeParse({ type: 'range' }).error?.issues[0].path).toEqual(['min']);
    expect(acceptanceRuleSchema.safeParse({ type: 'range', min: 5, max: 1 }).error?.issues[0].path).toEqual(['max']);
    expect(acceptanceRuleSchema.safeParse({ type: 'preset', presetId: 'no-such-limit' }).success).toBe(false);
    const wrongUnit = checklistItemSchema.safeParse({ kind: 'measurement', prompt: 'Earth continuity of the lead', unit: 'V', rule: { type: 'earth-continuity', lengthM: 2, csaMm2: 1 } });
    expect(wrongUnit.error?.issues[0]).toMatchObject({ path: ['unit'], message: 'this rule is in Ω' });
  });
});

describe('calendar arithmetic', () => {
  it('adds days and months on plain dates, clamping to the month end', () => {
    expect(addDays('2026-02-27', 2)).toBe('2026-03-01');
    expect(addMonths('2026-01-31', 1)).toBe('2026-02-28');
    expect(addMonths('2028-01-31', 1)).toBe('2028-02-29');
    expect(addMonths('2026-03-02', 12)).toBe('2027-03-02');
  });
});
