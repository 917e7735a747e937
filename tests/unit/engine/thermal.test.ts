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
    expect(r.caseC).toBeCloseTo(25 + 5 * (1 + 8), 9); // arithmetic: 70 °C
    expect(r.sinkC).toBeCloseTo(25 + 5 * 8, 9); // arithmetic: 65 °C
    expect(r.withinLimit).toBe(true);
  });

  // Worked example, https://newsletter.onedfrk.com/archive/1e9f02b0-75eb-49a1-a971-cbd548af4847 (linear regulator): 3.5 W, RθJC 5 + RθCS 1 + RθSA 10 °C/W, 25 °C → 81 °C.
  it('reproduces a second published chain example (3.5 W through 5 + 1 + 10 °C/W → 81 °C)', () => {
    const r = thermalCheck({ ...chain, rthJunctionCaseKW: 5, thresholdVoltageV: 0, slopeResistanceOhms: 0.14, averageCurrentA: 5, rmsCurrentA: 5, rthSinkAmbientKW: 10 });
    expect(r.conductionLossW).toBeCloseTo(3.5, 12);
    expect(r.junctionC).toBeCloseTo(81, 9);
  });

  // Sedra & Smith, Microelectronic Circuits, 5th ed., Section 14.8 (power transistors), the worked example of a transistor
  // on a heat sink (book and values from memory; example number not recalled): T_Jmax = 175 °C, P_D0 = 50 W at T_C0 = 25 °C,
  // so θ_JC = 3 °C/W; θ_CS = 0.6 °C/W, θ_SA = 4 °C/W, T_A = 25 °C → P_Dmax = 150 / 7.6 = 19.7 W, case ≈ 116 °C.
  it('reproduces the Sedra & Smith 5th ed. heat-sink example: 19.7 W through 3 + 0.6 + 4 °C/W reaches 175 °C (from memory)', () => {
    const pMax = (175 - 25) / (3 + 0.6 + 4);
    expect(pMax).toBeCloseTo(19.7, 1); // Sedra & Smith: P_Dmax = 19.7 W (from memory)
    const r = thermalCheck({ thresholdVoltageV: 1, slopeResistanceOhms: 0, averageCurrentA: pMax, rmsCurrentA: pMax, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.6, rthSinkAmbientKW: 4, ambientC: 25, maxJunctionC: 175 });
    expect(r.junctionC).toBeCloseTo(175, 9); // Sedra & Smith: T_J reaches T_Jmax = 175 °C at P_Dmax
    expect(r.caseC).toBeCloseTo(116, 0); // Sedra & Smith: T_C ≈ 116 °C (from memory)
    expect(r.withinLimit).toBe(true);
    const sized = thermalCheck({ thresholdVoltageV: 1, slopeResistanceOhms: 0, averageCurrentA: pMax, rmsCurrentA: pMax, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.6, ambientC: 25, maxJunctionC: 175 });
    expect(sized.maxSinkAmbientKW).toBeCloseTo(4, 9); // the same example read backwards: θ_SA = 4 °C/W
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

  it('says no heatsink is needed when the loss is too small to size one (no infinite heatsink figure)', () => {
    const r = thermalCheck({ thresholdVoltageV: 0, slopeResistanceOhms: 5e-324, averageCurrentA: 0, rmsCurrentA: 0.5, rthJunctionCaseKW: 0, rthCaseSinkKW: 0, rthSinkAmbientKW: 0, ambientC: 0, maxJunctionC: 1 });
    expect(r.maxSinkAmbientKW).toBeNull();
    expect(r.heatsinkPossible).toBe(true);
    expect(r.statement).toMatch(/no heatsink is needed/);
  });
});
