import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { evaluate } from 'mathjs';
import {
  calculateInductive, degToRad, extinctionAngle, extinctionResidual, inductivePhaseControl, loadAngle,
} from '../../../shared/engine';

const hart = { supplyVrms: 120, frequencyHz: 60, resistanceOhms: 20, inductanceH: 0.05, alphaRad: degToRad(90) };

describe('R-L load', () => {
  // Hart, Power Electronics, 1st ed. (McGraw-Hill, 2011), Example 6-3 (example number and answers from memory):
  // 120 V, 60 Hz, R = 20 Ω, L = 50 mH, α = 90°: θ = 43.3°, Z = 27.5 Ω, β ≈ 220°, I_rms = 2.71 A, I_SCR,rms = 1.92 A, P = 147 W.
  it('reproduces Hart 1st ed. Example 6-3 (from memory)', () => {
    const r = inductivePhaseControl(hart);
    expect(r.loadAngleDeg).toBeCloseTo(43.3, 1);
    expect(r.impedanceOhms).toBeCloseTo(27.5, 1);
    expect(Math.abs(r.extinctionAngleDeg - 220)).toBeLessThan(1);
    expect(r.loadCurrentRmsA).toBeCloseTo(2.71, 2);
    expect(r.perDirectionDevice.rmsA).toBeCloseTo(1.92, 2);
    expect(Math.abs(r.outputPowerW - 147)).toBeLessThan(1);
  });

  it('returns a β that satisfies the transcendental equation when substituted back', () => {
    const r = inductivePhaseControl(hart);
    const phi = degToRad(r.loadAngleDeg);
    const beta = degToRad(r.extinctionAngleDeg);
    // Independent evaluation of sin(β − φ) − sin(α − φ)·e^(−(β − α)/tan φ) through mathjs.
    const residual = evaluate('sin(b - p) - sin(a - p) * exp(-(b - a) / tan(p))', { a: hart.alphaRad, b: beta, p: phi });
    expect(Math.abs(residual)).toBeLessThan(1e-9);
  });

  it('conducts the full sine when α is at or below the load angle (standard result)', () => {
    const phi = loadAngle(60, 20, 0.05);
    const r = inductivePhaseControl({ ...hart, alphaRad: phi * 0.9 });
    expect(r.fullConduction).toBe(true);
    expect(r.conductionAngleDeg).toBe(180);
    expect(r.loadCurrentRmsA).toBeCloseTo(120 / Math.hypot(20, 2 * Math.PI * 60 * 0.05), 9);
  });

  it('reduces to the resistive case when L = 0 (Rashid 4th ed. Example 11.1 values: 84.85 V, 0.707)', () => {
    const r = inductivePhaseControl({ ...hart, resistanceOhms: 10, inductanceH: 0 });
    expect(r.extinctionAngleDeg).toBeCloseTo(180, 9);
    expect(r.outputVrms).toBeCloseTo(84.85, 2);
    expect(r.powerFactor).toBeCloseTo(0.707, 3);
  });

  it('agrees with a mathjs-evaluated integral of v² for the output RMS (closed form check)', () => {
    const r = inductivePhaseControl(hart);
    const a = hart.alphaRad;
    const b = degToRad(r.extinctionAngleDeg);
    const v2 = evaluate('f(t) = (sqrt(2) * 120 * sin(t))^2');
    const n = 4000;
    const h = (b - a) / n;
    let s = v2(a) + v2(b);
    for (let i = 1; i < n; i += 1) s += (i % 2 ? 4 : 2) * v2(a + i * h);
    expect(Math.abs(Math.sqrt(((h / 3) * s) / Math.PI) - r.outputVrms)).toBeLessThan(1e-6);
  });

  it('keeps the extinction angle between π and α + π (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: Math.PI - 0.01, noNaN: true }),
        fc.double({ min: 0.001, max: Math.PI / 2 - 0.001, noNaN: true }),
        (alpha, phi) => {
          const beta = extinctionAngle(alpha, phi);
          if (alpha <= phi) return beta === alpha + Math.PI;
          return beta > Math.PI && beta < alpha + Math.PI && Math.abs(extinctionResidual(beta, alpha, phi)) < 1e-9;
        },
      ),
    );
  });

  it('flags a universal motor as not modelled and gives no figures', () => {
    const r = calculateInductive({ supply: { voltageRms: 230, frequencyHz: 50 }, resistanceOhms: 20, inductanceH: 0.1, alphaDeg: 90, loadKind: 'universal-motor', waveform: false, samples: 100, waveformCycles: 2 });
    expect(r.loadModel).toMatchObject({ modelled: false, estimate: true });
    expect(r.loadModel.note).toMatch(/back-EMF/);
    expect(r.figures).toBeNull();
  });

  it('flags a cold lamp filament as an estimate with an inrush range from the 1/15 to 1/10 cold ratio (from memory)', () => {
    const r = calculateInductive({ supply: { voltageRms: 230, frequencyHz: 50 }, resistanceOhms: 881.7, inductanceH: 0, alphaDeg: 90, loadKind: 'lamp-filament', waveform: false, samples: 100, waveformCycles: 2 });
    expect(r.loadModel).toMatchObject({ modelled: false, estimate: true });
    expect(r.inrush?.minA).toBeCloseTo((Math.SQRT2 * 230 * 10) / 881.7, 6);
    expect(r.inrush?.maxA).toBeCloseTo((Math.SQRT2 * 230 * 15) / 881.7, 6);
  });

  it('stays finite at the edges: a vanishing load angle just below 180°, and no current at all at 180° (PF taken as its limit, 0)', () => {
    // Found by fuzzing the schema-valid inputs: this once threw "root is not bracketed".
    const edge = inductivePhaseControl({ supplyVrms: 1e-3, frequencyHz: 40, resistanceOhms: 1e-6, inductanceH: 5e-324, alphaRad: degToRad(179.99995605468752) });
    expect(edge.extinctionAngleDeg).toBeCloseTo(180, 6); // φ → 0: the current stops at the voltage zero (resistive limit)
    const off = inductivePhaseControl({ ...hart, alphaRad: Math.PI });
    expect(off.loadCurrentRmsA).toBe(0);
    expect(off.powerFactor).toBe(0);
  });
});
