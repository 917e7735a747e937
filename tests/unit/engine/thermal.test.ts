import { describe, it, expect } from 'vitest';
import { conductionLoss, resistivePhaseControl, thermalCheck } from '../../../shared/engine';

const chain = { rthJunctionCaseKW: 3, rthCaseSinkKW: 1, ambientC: 25, maxJunctionC: 125 };

describe('thermal check', () => {
  // Worked example, https://theprimecalculator.com/de/electronics/thermal-resistance-electronics/formula:
  // 5 W, θjc = 3, θcs = 1, θsa = 8 °C/W, 25 °C ambient → Tj = 85 °C.
  it('reproduces a published junction-temperature worked example (5 W through 3 + 1 + 8 °C/W → 85 °C)', () => {
    const r = thermalCheck({ ...chain, thresholdVoltageV: 1, slopeResistanceOhms: 0, averageCurrentA: 5, rmsCurrentA: 5, rthSinkAmbientKW: 8 });
    expect(r.conductionLossW).toBeCloseTo(5, 12);
    expect(r.junctionC).toBeCloseTo(85, 9);
    expect(r.withinLimit).toBe(true);
  });

  // Worked example, https://newsletter.onedfrk.com/archive/1e9f02b0-75eb-49a1-a971-cbd548af4847 (linear regulator): 3.5 W, RθJC 5 + RθCS 1 + RθSA 10 °C/W, 25 °C → 81 °C.
  it('reproduces a second published chain example (3.5 W through 5 + 1 + 10 °C/W → 81 °C)', () => {
    const r = thermalCheck({ ...chain, rthJunctionCaseKW: 5, thresholdVoltageV: 0, slopeResistanceOhms: 0.14, averageCurrentA: 5, rmsCurrentA: 5, rthSinkAmbientKW: 10 });
    expect(r.conductionLossW).toBeCloseTo(3.5, 12);
    expect(r.junctionC).toBeCloseTo(81, 9);
  });

  // Hand arithmetic: a 1 kW, 230 V heater at full conduction through a triac with V_T0 = 1.0 V, r_T = 30 mΩ.
  it('computes V_T0·I_T(AV) + r_T·I_T(RMS)² from the triac currents and sizes the heatsink (arithmetic)', () => {
    const op = resistivePhaseControl({ supplyVrms: 230, frequencyHz: 50, resistanceOhms: 52.9, alphaRad: 0 });
    const loss = conductionLoss(1.0, 0.03, op.triac.meanAbsA, op.triac.rmsA);
    expect(op.triac.meanAbsA).toBeCloseTo(3.914, 3); // 2√2·230/(π·52.9)
    expect(loss).toBeCloseTo(3.914 + 0.03 * 4.348 ** 2, 2);
    const r = thermalCheck({ thresholdVoltageV: 1, slopeResistanceOhms: 0.03, averageCurrentA: op.triac.meanAbsA, rmsCurrentA: op.triac.rmsA, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.5, ambientC: 40, maxJunctionC: 125 });
    expect(r.maxSinkAmbientKW).toBeCloseTo(85 / loss - 3.5, 9);
    const atLimit = thermalCheck({ thresholdVoltageV: 1, slopeResistanceOhms: 0.03, averageCurrentA: op.triac.meanAbsA, rmsCurrentA: op.triac.rmsA, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.5, rthSinkAmbientKW: r.maxSinkAmbientKW as number, ambientC: 40, maxJunctionC: 125 });
    expect(atLimit.junctionC).toBeCloseTo(125, 9);
  });

  it('says plainly that no heatsink can help when the device and interface alone exceed Tj,max', () => {
    const r = thermalCheck({ thresholdVoltageV: 1, slopeResistanceOhms: 0, averageCurrentA: 30, rmsCurrentA: 30, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.5, ambientC: 40, maxJunctionC: 125 });
    expect(r.heatsinkPossible).toBe(false);
    expect(r.maxSinkAmbientKW).toBeNull();
    expect(r.statement).toMatch(/No heatsink can/);
  });
});
