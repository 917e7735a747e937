import { describe, it, expect } from 'vitest';
import {
  calculateEarthContinuity, calculateInductive, calculateInverse, calculateLimitCheck, calculateRatings, calculateResistive,
  calculateThermal, calculateTrigger, EngineError,
} from '../../../shared/engine';
import {
  earthContinuityInputSchema, inductiveInputSchema, inverseInputSchema, limitCheckInputSchema, ratingsInputSchema,
  resistiveInputSchema, thermalInputSchema, triggerInputSchema,
} from '../../../shared/schemas/engine';

const supply = { voltageRms: 120, frequencyHz: 60 };
/** The result must survive JSON unchanged (no Infinity, NaN or undefined-only fields lost). */
const roundTrips = (value: unknown) => expect(JSON.parse(JSON.stringify(value))).toEqual(value);

describe('calculator modes (validated input → JSON-serialisable result)', () => {
  it('resistive: Rashid 4th ed. Example 11.1 through the schema (84.85 V, PF 0.707)', () => {
    const r = calculateResistive(resistiveInputSchema.parse({ supply, load: { kind: 'resistance', ohms: 10 }, alphaDeg: 90 }));
    expect(r.outputVrms).toBeCloseTo(84.85, 2); // Rashid 4th ed. Ex. 11.1
    expect(r.powerFactor).toBeCloseTo(0.707, 3); // Rashid 4th ed. Ex. 11.1
    expect(r.waveform).toBeNull(); // samples only on request
    roundTrips(r);
  });

  it('resistive: returns the waveform on request, bounded by samples and cycles', () => {
    const r = calculateResistive(resistiveInputSchema.parse({ supply, load: { kind: 'resistance', ohms: 10 }, alphaDeg: 90, waveform: true, samples: 120, waveformCycles: 1 }));
    expect(r.waveform?.t).toHaveLength(120);
    expect(r.waveform?.t.at(-1)).toBeCloseTo(1 / 60, 12); // one 60 Hz cycle (definition)
    expect(r.waveform?.firingPoints).toHaveLength(2);
    roundTrips(r);
  });

  it('inverse: 720 W on the Rashid Ex. 11.1 load is α = 90° (half of 1440 W, common practice)', () => {
    const r = calculateInverse(inverseInputSchema.parse({ supply, load: { kind: 'resistance', ohms: 10 }, target: { kind: 'power', watts: 720 } }));
    expect(r.alphaDeg).toBeCloseTo(90, 5);
    roundTrips(r);
  });

  it('inductive: Hart 1st ed. Ex. 6-3 through the schema (β ≈ 220°, from memory)', () => {
    const r = calculateInductive(inductiveInputSchema.parse({ supply, resistanceOhms: 20, inductanceH: 0.05, alphaDeg: 90 }));
    expect(r.loadModel.modelled).toBe(true);
    expect(Math.abs((r.figures?.extinctionAngleDeg ?? 0) - 220)).toBeLessThan(1);
    roundTrips(r);
  });

  it('trigger: reports the simulated angle as the expectation, the estimate apart, and the settled cycles on request', () => {
    const input = triggerInputSchema.parse({
      supply: { voltageRms: 230, frequencyHz: 50 }, loadOhms: 529, fixedResistanceOhms: 3300, potentiometerOhms: 470e3, setting: 0.3, capacitanceF: 100e-9,
      diac: { breakoverV: 32, breakbackV: 6 }, device: { latchingCurrentA: 0.04, holdingCurrentA: 0.025, gateTriggerCurrentA: 0.025, gateTriggerVoltageV: 1 },
      simulation: { cycles: 4, stepsPerCycle: 2000 }, waveform: true, samples: 500, waveformCycles: 2,
    });
    const r = calculateTrigger(input);
    const alpha = r.expectedFiringAngleDeg as number;
    expect(alpha).toBe(r.simulation.steadyStateFiringAngleDeg);
    expect(r.estimate.estimate).toBe(true);
    expect(r.waveform?.t.length).toBeLessThanOrEqual(500);
    expect(r.waveform?.t[0]).toBeCloseTo(0, 12); // re-timed from the zero crossing two cycles before the end
    expect(r.waveform?.t.at(-1)).toBeCloseTo(2 / 50, 3);
    expect(r.waveform?.firingPoints).toHaveLength(4); // one per half-cycle of the two settled cycles
    expect(r.waveform?.firingPoints[2].t).toBeCloseTo((360 + r.simulation.halfCycles[6].firingAngleDeg!) / 360 / 50, 12);
    // Power at the simulated angle follows the closed form for the 529 Ω (100 W at 230 V) load.
    expect(r.load.powerFraction).toBeCloseTo(1 - alpha / 180 + Math.sin((2 * alpha * Math.PI) / 180) / (2 * Math.PI), 12);
    expect(calculateTrigger({ ...input, waveform: false }).waveform).toBeNull();
    roundTrips(r);
  });

  it('thermal, ratings, limits and earth continuity produce serialisable results', () => {
    const thermal = calculateThermal(thermalInputSchema.parse({
      thresholdVoltageV: 1, slopeResistanceOhms: 0.03, averageCurrentA: 3.9, rmsCurrentA: 4.35, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.5, ambientC: 40, maxJunctionC: 125,
    }));
    const ratings = calculateRatings(ratingsInputSchema.parse({
      supply, loadCurrentA: 8.5, vdrmV: 400, capacitor: { position: 'line-to-line', safetyClass: 'X2', ratedVac: 275 },
      triggerResistors: { fixedOhms: 3300, potOhms: 250e3, setting: 0.5, capacitanceF: 100e-9, fixedRatingW: 0.25, potRatingW: 0.5 },
    }));
    expect(ratings.fuse.ratingA).toBe(12.5); // 10.6 A → 12.5 A on R10
    expect(ratings.deviceVoltage.ok).toBe(true); // 400 V ≥ 2 × 169.7 V (common practice)
    const limit = calculateLimitCheck(limitCheckInputSchema.parse({ presetId: 'rcd-30ma-1x', measured: 24 }));
    const earth = calculateEarthContinuity(earthContinuityInputSchema.parse({ lengthM: 2, csaMm2: 1, measuredOhm: 0.12 }));
    expect(limit.pass).toBe(true);
    expect(earth.verdict?.pass).toBe(true);
    [thermal, ratings, limit, earth].forEach(roundTrips);
  });

  it('names the field when a limit preset does not exist', () => {
    expect(() => calculateLimitCheck({ presetId: 'nope', measured: 1 })).toThrow(EngineError);
    expect(() => calculateLimitCheck({ presetId: 'nope', measured: 1 })).toThrow(expect.objectContaining({ field: 'presetId' }));
  });
});
