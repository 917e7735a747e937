import { describe, it, expect } from 'vitest';
import { EngineError } from '../../../shared/engine';
import {
  LIMIT_PRESETS, COPPER_RESISTIVITY, earthContinuityPreset, evaluateAgainstPreset, findPreset, gfciMaxTripTimeS, leadResistanceOhm,
} from '../../../shared/engine';

const valueOf = (id: string) => {
  const p = findPreset(id);
  if (!p || p.comparison === 'range' || p.comparison === 'no-trip') throw new Error(`no single-value preset ${id}`);
  return p.value;
};

describe('published acceptance limits', () => {
  // IEC 61008-1 / IEC 61009-1, Table 1 (limit values of break time, general type), from memory.
  it('holds the RCD break times of IEC 61008-1 / 61009-1 Table 1 (from memory): 300, 150, 40 ms', () => {
    expect(valueOf('rcd-30ma-1x')).toBe(300);
    expect(valueOf('rcd-30ma-2x')).toBe(150);
    expect(valueOf('rcd-30ma-5x')).toBe(40);
    expect(findPreset('rcd-30ma-1x')?.note).toMatch(/Type A/);
    expect(findPreset('rcd-30ma-half')).toMatchObject({ comparison: 'no-trip', testDurationMs: 300 });
  });

  // IEC 60364-6 Table 6.1 / BS 7671 Table 64: SELV/PELV 0.5 MΩ at 250 V DC; ≤ 500 V 1 MΩ at 500 V DC; > 500 V 1 MΩ at 1000 V DC.
  it('holds the installation insulation minimums of IEC 60364-6 Table 6.1 / BS 7671 Table 64', () => {
    expect(valueOf('insulation-installation-selv-pelv')).toBe(0.5);
    expect(valueOf('insulation-installation-up-to-500v')).toBe(1);
    expect(valueOf('insulation-installation-above-500v')).toBe(1);
    expect(findPreset('insulation-installation-up-to-500v')?.source.table).toMatch(/Table 6\.1.*Table 64/);
  });

  // IET Code of Practice for In-service Inspection and Testing of Electrical Equipment (from memory): Class I 1 MΩ, Class II 2 MΩ.
  it('keeps in-service equipment limits by protection class apart from installation limits (IET CoP, from memory)', () => {
    expect(valueOf('insulation-equipment-class-i')).toBe(1);
    expect(valueOf('insulation-equipment-class-ii')).toBe(2);
    expect(findPreset('insulation-equipment-class-ii')?.source.standard).toMatch(/In-service/);
    expect(findPreset('insulation-installation-up-to-500v')?.source.standard).not.toMatch(/In-service/);
  });

  it('names a standard, an edition and a table for every preset', () => {
    for (const p of LIMIT_PRESETS) {
      expect(p.source.standard.length).toBeGreaterThan(3);
      expect(p.source.edition.length).toBeGreaterThan(3);
      expect(p.source.table.length).toBeGreaterThan(3);
    }
    expect(new Set(LIMIT_PRESETS.map((p) => p.id)).size).toBe(LIMIT_PRESETS.length);
  });

  // UL 943 (from memory): T = (20/I)^1.43 s, I in mA; 6 mA → about 5.6 s; at most 25 ms above 264 mA.
  it('computes the UL 943 GFCI trip-time curve (from memory)', () => {
    expect(gfciMaxTripTimeS(6)).toBeCloseTo((20 / 6) ** 1.43, 12);
    expect(gfciMaxTripTimeS(6)).toBeCloseTo(5.59, 2);
    expect(gfciMaxTripTimeS(264)).toBeCloseTo(0.0250, 3);
    expect(gfciMaxTripTimeS(500)).toBe(0.025);
    expect(gfciMaxTripTimeS(3)).toBeNull();
    const band = findPreset('gfci-class-a-trip-current');
    expect(band).toMatchObject({ comparison: 'range', min: 4, max: 6 });
  });

  // IET Code of Practice per-metre values (from memory): 1.0 mm² ≈ 19.5 mΩ/m, plus the 0.1 Ω allowance.
  it('computes the earth continuity limit for a lead from the code of practice table (from memory)', () => {
    expect(earthContinuityPreset(2, 1).value).toBeCloseTo(0.1 + 2 * 0.0195, 12);
    expect(earthContinuityPreset(5, 0.75).value).toBeCloseTo(0.1 + 5 * 0.026, 12);
    expect(earthContinuityPreset(3, 1.5).value).toBeCloseTo(0.1 + 3 * 0.013, 12);
  });

  it('falls back to copper resistivity 0.0172 Ω·mm²/m (general reference value) off the table', () => {
    expect(COPPER_RESISTIVITY).toBe(0.0172);
    expect(leadResistanceOhm(10, 2.5)).toBeCloseTo((0.0172 * 10) / 2.5, 12);
    expect(earthContinuityPreset(10, 2.5).source.table).toMatch(/resistivity/);
    expect(leadResistanceOhm(2, 1, 'resistivity')).toBeCloseTo(0.0344, 12);
  });

  it('evaluates a measured value against max, min and range presets', () => {
    expect(evaluateAgainstPreset(findPreset('rcd-30ma-1x')!, 280).pass).toBe(true);
    expect(evaluateAgainstPreset(findPreset('rcd-30ma-1x')!, 320).pass).toBe(false);
    expect(evaluateAgainstPreset(findPreset('rcd-30ma-5x')!, 40).rule).toBe('≤ 40 ms');
    expect(evaluateAgainstPreset(findPreset('insulation-equipment-class-ii')!, 1.5).pass).toBe(false);
    expect(evaluateAgainstPreset(findPreset('gfci-class-a-trip-current')!, 5.2).pass).toBe(true);
    expect(evaluateAgainstPreset(findPreset('gfci-class-a-trip-current')!, 7).pass).toBe(false);
  });

  // IEC 61008-1 / 61009-1 (from memory): no trip at 0.5×IΔn; test applied for at least the 300 ms 1×IΔn break time (common practice, from memory).
  it('passes the 0.5×IΔn test when the RCD did not trip or held for the whole test, and fails an earlier trip', () => {
    const half = findPreset('rcd-30ma-half')!;
    expect(evaluateAgainstPreset(half, 'did-not-trip')).toMatchObject({ pass: true, measured: 'did-not-trip', rule: 'no trip within 300 ms' });
    expect(evaluateAgainstPreset(half, 300).pass).toBe(true);
    expect(evaluateAgainstPreset(half, 2000).pass).toBe(true);
    expect(evaluateAgainstPreset(half, 120).pass).toBe(false);
    expect(evaluateAgainstPreset(half, 0).pass).toBe(false);
  });

  it('fails a break-time test when the RCD did not trip at all', () => {
    expect(evaluateAgainstPreset(findPreset('rcd-30ma-1x')!, 'did-not-trip').pass).toBe(false);
    expect(evaluateAgainstPreset(findPreset('rcd-30ma-5x')!, 'did-not-trip').pass).toBe(false);
  });

  it('refuses "did not trip" for a reading that is not a trip time, naming the field', () => {
    const attempt = () => evaluateAgainstPreset(findPreset('insulation-equipment-class-i')!, 'did-not-trip');
    expect(attempt).toThrow(EngineError);
    expect(attempt).toThrow(expect.objectContaining({ field: 'measured' }));
  });
});
