import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { evaluate, range, sum } from 'mathjs';
import { degToRad, loadResistance, outputRmsRatio, powerFraction, resistivePhaseControl } from '../../../shared/engine';

const at = (alphaDeg: number, r = 10, v = 120, f = 60) =>
  resistivePhaseControl({ supplyVrms: v, frequencyHz: f, resistanceOhms: r, alphaRad: degToRad(alphaDeg) });

describe('resistive load at firing angle α', () => {
  // Rashid, Power Electronics: Devices, Circuits, and Applications, 4th ed., Example 11.1: 120 V, 60 Hz, R = 10 Ω, α = 90°.
  it('reproduces Rashid 4th ed. Example 11.1', () => {
    const r = at(90);
    expect(r.outputVrms).toBeCloseTo(84.85, 2); // Rashid Ex. 11.1: Vo = 84.85 V
    expect(r.powerFactor).toBeCloseTo(0.707, 3); // Rashid Ex. 11.1: PF = 0.707
    expect(r.perDirectionDevice.averageA).toBeCloseTo(2.7, 2); // Rashid Ex. 11.1: I_A = 2.70 A
    expect(r.perDirectionDevice.rmsA).toBeCloseTo(6.0, 2); // Rashid Ex. 11.1: I_R = 6.0 A
  });

  it('gives full power at 0°, half at 90° and none at 180° (common practice)', () => {
    expect(at(0).powerFraction).toBeCloseTo(1, 12);
    expect(at(90).powerFraction).toBeCloseTo(0.5, 12);
    expect(at(180).powerFraction).toBeCloseTo(0, 12);
    expect(at(180).outputPowerW).toBeCloseTo(0, 9);
    expect(at(0).conductionAngleDeg).toBe(180);
  });

  it('reports the delay after the zero crossing as α/(2πf) (definition: 90° at 50 Hz is 5 ms)', () => {
    expect(at(90, 10, 230, 50).delayTimeS).toBeCloseTo(0.005, 12);
  });

  it('relates triac, anti-parallel SCR and bridge figures as the waveform requires (common practice)', () => {
    const r = at(60, 52.9, 230, 50);
    expect(r.triac.meanAbsA).toBeCloseTo(2 * r.perDirectionDevice.averageA, 12);
    expect(r.triac.rmsA).toBeCloseTo(Math.SQRT2 * r.perDirectionDevice.rmsA, 12);
    expect(r.scrInBridge.scr.rmsA).toBeCloseTo(r.loadCurrentRmsA, 12);
    expect(r.scrInBridge.eachDiode.averageA).toBeCloseTo(r.perDirectionDevice.averageA, 12);
    expect(r.outputPowerW).toBeCloseTo(r.loadCurrentRmsA ** 2 * 52.9, 9);
  });

  it('turns a rated power at rated voltage into the hot resistance (60 W at 230 V is 881.7 Ω, arithmetic)', () => {
    expect(loadResistance({ kind: 'rated', ratedPowerW: 60, ratedVoltageV: 230 })).toBeCloseTo(881.667, 3);
  });

  // Independent check: Simpson's rule written with mathjs evaluate/range/sum, not the engine's own integrator.
  it('agrees with a mathjs numerical integral of v² over the conduction interval to 1e-6', () => {
    const f = evaluate('f(t) = sin(t)^2');
    for (let deg = 0; deg <= 180; deg += 7.5) {
      const a = degToRad(deg);
      const n = 2000;
      const h = (Math.PI - a) / n;
      const nodes = range(0, n + 1).toArray() as number[];
      const weights = nodes.map((i) => (i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2));
      const integral = h === 0 ? 0 : (h / 3) * (sum(nodes.map((i, k) => weights[k] * f(a + i * h))) as number);
      const numeric = Math.sqrt((2 * integral) / Math.PI); // (Vout/V)² = (1/π)∫ 2 sin²θ dθ since Vm² = 2V²
      expect(Math.abs(numeric - outputRmsRatio(a))).toBeLessThan(1e-6);
    }
  });

  it('has power falling monotonically as α rises (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: Math.PI, noNaN: true }), fc.double({ min: 0, max: Math.PI, noNaN: true }), (x, y) => {
        const [lo, hi] = x < y ? [x, y] : [y, x];
        return powerFraction(hi) <= powerFraction(lo) + 1e-15;
      }),
    );
  });

  it('refuses a firing angle outside 0..π with a named field', () => {
    expect(() => resistivePhaseControl({ supplyVrms: 230, frequencyHz: 50, resistanceOhms: 10, alphaRad: 4 })).toThrow(
      expect.objectContaining({ field: 'alphaDeg' }),
    );
  });
});
