import { describe, it, expect } from 'vitest';
import { degToRad, idealWaveform } from '../../../shared/engine';

describe('ideal waveform samples for plotting', () => {
  it('cuts the output before α and follows the supply after it (resistive, definition of phase control)', () => {
    const w = idealWaveform({ supplyVrms: 230, frequencyHz: 50, alphaRad: degToRad(90), cycles: 1, points: 361 });
    expect(w.t).toHaveLength(361);
    expect(w.output[45]).toBe(0); // 45°: before firing
    expect(w.output[135]).toBeCloseTo(w.supply[135], 12); // 135°: conducting
    expect(w.output[225]).toBe(0); // 225°: 45° into the negative half-cycle
    expect(w.output[315]).toBeCloseTo(w.supply[315], 12);
    expect(w.firingPoints.map((p) => p.angleDeg)).toEqual([90, 90]);
    expect(w.firingPoints[0].supplyV).toBeCloseTo(Math.SQRT2 * 230, 9);
  });

  it('keeps an R-L output on past the zero crossing until β (Hart 1st ed. Ex. 6-3 load, β ≈ 220°, from memory)', () => {
    const w = idealWaveform({ supplyVrms: 120, frequencyHz: 60, alphaRad: degToRad(90), resistanceOhms: 20, inductanceH: 0.05, cycles: 1, points: 361 });
    expect(w.output[200]).toBeCloseTo(w.supply[200], 12); // 200° < β: still conducting, output negative
    expect(w.output[200]).toBeLessThan(0);
    expect(w.output[230]).toBe(0); // past β, before the next firing at 270°
  });

  it('returns no output and no firing points at α = 180°', () => {
    const w = idealWaveform({ supplyVrms: 230, frequencyHz: 50, alphaRad: Math.PI, cycles: 2, points: 100 });
    expect(w.output.every((v) => v === 0)).toBe(true);
    expect(w.firingPoints).toHaveLength(0);
  });
});
