import { describe, it, expect } from 'vitest';
import { computeExpectations } from '../../../shared/practicals/expectations.js';
import { circuitSchema } from '../../../shared/schemas/practicals.js';
import { resistivePhaseControl } from '../../../shared/engine/resistive.js';
import { degToRad } from '../../../shared/engine/numeric.js';
import { judgeReading } from '../../../shared/practicals/entries.js';

// A 230 V / 50 Hz bench, a 100 W lamp-like resistive load (529 Ω), an RC–diac trigger, and a triac
// with datasheet-style thermal figures on a small heatsink.
const circuit = circuitSchema.parse({
  load: { kind: 'resistance', ohms: 529 },
  trigger: {
    fixedResistanceOhms: 3300, potentiometerOhms: 470_000, setting: 0.3, capacitanceF: 100e-9, breakoverV: 32, breakbackV: 6,
    latchingCurrentA: 0.04, holdingCurrentA: 0.025, gateTriggerCurrentA: 0.025, gateTriggerVoltageV: 1,
  },
  thermal: { thresholdVoltageV: 1.1, slopeResistanceOhms: 0.05, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.5, rthSinkAmbientKW: 20, ambientC: 25, maxJunctionC: 125 },
});
const supply = { voltageRms: 230, frequencyHz: 50 };

describe('thermal quantities a checklist can compare against', () => {
  it('when the circuit has thermal figures with a heatsink, then the case and heatsink temperatures follow the thermal-resistance chain', () => {
    const e = computeExpectations(circuit, supply);
    const alpha = e.quantities['firing-angle']!;
    // The loss from first principles: P = V_T0·I_T(AV) + r_T·I_T(RMS)², with the triac's full-cycle mean |i|
    // and RMS at the simulated firing angle (the conduction-loss model of power-device datasheets; common practice).
    const { triac } = resistivePhaseControl({ supplyVrms: 230, frequencyHz: 50, resistanceOhms: 529, alphaRad: degToRad(alpha) });
    const loss = 1.1 * triac.meanAbsA + 0.05 * triac.rmsA ** 2;
    expect(e.thermal!.conductionLossW).toBeCloseTo(loss, 9);
    // Steady state: T = T_ambient + P · (the thermal resistances between that point and the air) (arithmetic).
    expect(e.quantities['heatsink-temperature']).toBeCloseTo(25 + loss * 20, 9);
    expect(e.quantities['case-temperature']).toBeCloseTo(25 + loss * (0.5 + 20), 9);
    // A 100 W load draws well under 1 A: the device barely warms (sanity bound, arithmetic: P < 1.1 V · 0.44 A + 0.05 Ω · 0.44² A²).
    expect(loss).toBeLessThan(1.1 * 0.44 + 0.05 * 0.44 ** 2);
  });

  it('when no heatsink value is given, then there is no computed temperature and the assessor judges the reading', () => {
    const { rthSinkAmbientKW: _none, ...withoutSink } = circuit.thermal!;
    const e = computeExpectations({ ...circuit, thermal: withoutSink }, supply);
    expect(e.quantities['case-temperature']).toBeUndefined();
    const rule = { type: 'computed' as const, quantity: 'case-temperature' as const, tolerance: { mode: 'absolute' as const, value: 5 } };
    expect(judgeReading(rule, '°C', 31, e.quantities)).toMatchObject({ verdict: null, expected: null });
    expect(judgeReading(rule, '°C', 31, e.quantities, 'pass')).toMatchObject({ verdict: 'pass', judgedBy: 'assessor' });
  });

  it('when a case reading is within the tolerance of the computed figure, then it passes; outside, it fails', () => {
    const e = computeExpectations(circuit, supply);
    const expected = e.quantities['case-temperature']!;
    const rule = { type: 'computed' as const, quantity: 'case-temperature' as const, tolerance: { mode: 'absolute' as const, value: 5 } };
    expect(judgeReading(rule, '°C', expected + 4, e.quantities).verdict).toBe('pass');
    expect(judgeReading(rule, '°C', expected + 6, e.quantities).verdict).toBe('fail');
  });
});
