import { describe, it, expect } from 'vitest';
import { abs, complex, add, divide, multiply } from 'mathjs';
import { checkCapacitorClass, checkDeviceVoltage, nextPreferredValue, suggestFuse, triggerResistorDissipation } from '../../../shared/engine';

describe('protective ratings', () => {
  it('picks the next Renard R10 value (ISO 3; IEC 60127 ratings) at or above current × 1.25 (common practice margin)', () => {
    expect(suggestFuse(4.348).ratingA).toBe(6.3); // 5.435 A → 6.3 A
    expect(suggestFuse(1.6).ratingA).toBe(2); // exactly 2 A → 2 A
    expect(suggestFuse(0.25).ratingA).toBe(0.315); // 0.3125 A → 315 mA
    expect(suggestFuse(2.6, 1).ratingA).toBe(3.15);
    expect(nextPreferredValue(8.5)).toBe(10);
  });

  it('uses the IEC 60269 list when asked (values from memory)', () => {
    expect(suggestFuse(11, 1.25, 'IEC60269').ratingA).toBe(16);
  });

  it('names the load current when it needs more than the largest listed IEC 60269 rating (125 A, from memory)', () => {
    expect(() => suggestFuse(110, 1.25, 'IEC60269')).toThrow(expect.objectContaining({ name: 'EngineError', field: 'loadCurrentA' }));
  });

  it('checks V_DRM against twice the supply peak (common practice): 230 V needs 650 V, so 600 V fails, 800 V passes', () => {
    expect(checkDeviceVoltage(230, 600).requiredV).toBeCloseTo(2 * Math.SQRT2 * 230, 9);
    expect(checkDeviceVoltage(230, 600).ok).toBe(false);
    expect(checkDeviceVoltage(230, 800).ok).toBe(true);
    expect(checkDeviceVoltage(120, 400).ok).toBe(true); // 339 V needed
  });

  it('requires X (or Y) across the line and Y line to earth (IEC 60384-14, from memory)', () => {
    expect(checkCapacitorClass('line-to-line', 'X2', 275, 230).ok).toBe(true);
    expect(checkCapacitorClass('line-to-earth', 'X2', 275, 230).ok).toBe(false);
    expect(checkCapacitorClass('line-to-earth', 'Y2', 300, 230).ok).toBe(true);
    expect(checkCapacitorClass('line-to-line', 'none', 400, 230).ok).toBe(false);
    expect(checkCapacitorClass('line-to-line', 'X2', 110, 230).voltageOk).toBe(false);
    expect(checkCapacitorClass('line-to-line', 'X1', 275, 230).description).toMatch(/4 kV/);
  });

  it('computes trigger resistor dissipation from the RC branch current (checked with mathjs complex impedance)', () => {
    const p = { supplyVrms: 230, frequencyHz: 50, fixedOhms: 3300, potOhms: 470e3, setting: 0.5, capacitanceF: 100e-9, fixedRatingW: 0.25, potRatingW: 0.5 };
    const zc = divide(1, complex(0, 2 * Math.PI * 50 * 100e-9));
    const z = add(complex(3300 + 0.5 * 470e3, 0), zc);
    const i = 230 / (abs(z) as unknown as number);
    const r = triggerResistorDissipation(p);
    expect(r.branchCurrentRmsA).toBeCloseTo(i, 12);
    expect(r.fixed.dissipationW).toBeCloseTo(Number(multiply(i * i, 3300)), 12);
    expect(r.potentiometer.dissipationW).toBeCloseTo(i * i * 235e3, 9);
    expect(r.fixed.ok).toBe(true); // ≈ 0.17 W worst case with the pot at zero
  });
});
