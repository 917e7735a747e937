import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { arg, complex, divide, abs } from 'mathjs';
import { estimateFiring, estimateFiringRange, simulateTrigger, type SimulationParams } from '../../../shared/engine';

// A typical 230 V / 50 Hz lamp-dimmer trigger (values common practice): 3.3 kΩ + 470 kΩ pot, 100 nF, 32 V diac.
const network = {
  supplyVrms: 230, frequencyHz: 50, fixedResistanceOhms: 3300, potentiometerOhms: 470e3, capacitanceF: 100e-9, breakoverV: 32, loadOhms: 529,
};
const sim = (setting: number, over: Partial<SimulationParams> = {}) =>
  simulateTrigger({
    ...network, setting, breakbackV: 6, gateTriggerCurrentA: 0.025, gateTriggerVoltageV: 1, latchingCurrentA: 0.04,
    holdingCurrentA: 0.025, onStateVoltageV: 1.2, gateCircuitOhms: 50, cycles: 6, stepsPerCycle: 2000, maxPoints: 4000, ...over,
  });

describe('RC + diac trigger: first-order estimate', () => {
  it('matches the RC divider phasor computed independently with mathjs complex numbers', () => {
    const setting = 0.2;
    const r = network.fixedResistanceOhms + setting * network.potentiometerOhms + network.loadOhms;
    const wrc = 2 * Math.PI * 50 * r * network.capacitanceF;
    const gain = divide(complex(1, 0), complex(1, wrc)); // Vc/Vs = 1 / (1 + jωRC)
    const peak = Math.SQRT2 * 230 * (abs(gain) as unknown as number);
    const lagDeg = (-arg(gain as never) * 180) / Math.PI;
    const expected = lagDeg + (Math.asin(32 / peak) * 180) / Math.PI;
    const e = estimateFiring(network, setting);
    expect(e.estimate).toBe(true);
    expect(e.capacitorPeakV).toBeCloseTo(peak, 9);
    expect(e.phaseLagDeg).toBeCloseTo(lagDeg, 9);
    expect(e.firingAngleDeg).toBeCloseTo(expected, 9);
  });

  it('reports "does not fire" where the capacitor peak stays below breakover, and the setting where that starts', () => {
    const range = estimateFiringRange(network);
    expect(range.atMaximum.fires).toBe(false);
    expect(range.atMaximum.firingAngleDeg).toBeNull();
    expect(range.stopsFiringAtSetting).not.toBeNull();
    const s = range.stopsFiringAtSetting as number;
    expect(estimateFiring(network, s - 1e-6).fires).toBe(true);
    expect(estimateFiring(network, s + 1e-6).fires).toBe(false);
    expect(range.earliestDeg).toBeLessThan(range.latestDeg as number);
  });

  it('fires across the whole travel with a smaller pot (range ends at setting 1)', () => {
    const range = estimateFiringRange({ ...network, potentiometerOhms: 100e3 });
    expect(range.stopsFiringAtSetting).toBeNull();
    expect(range.latestDeg).toBe(range.atMaximum.firingAngleDeg);
  });
});

describe('RC + diac trigger: time-domain simulation', () => {
  it('fires EARLIER than the first-order estimate on a known case (the reset effect)', () => {
    // The estimate assumes a steady sine on the capacitor, which starts each half-cycle at the opposite polarity; in the
    // circuit the diac dump and the conducting device (which shorts the network) have pulled it towards zero, so it
    // reaches breakover sooner.
    const e = estimateFiring(network, 0.3);
    const run = sim(0.3, { maxPoints: 12001 }); // every step kept: 6 cycles × 2000
    const simulated = run.steadyStateFiringAngleDeg as number;
    expect(simulated).not.toBeNull();
    expect((e.firingAngleDeg as number) - simulated).toBeGreaterThan(10);
    // At the zero crossing that starts the last half-cycle the steady sine sits at peak·sin(lag);
    // the simulated capacitor holds far less, because firing and conduction pulled it down.
    const steadySine = e.capacitorPeakV * Math.sin((e.phaseLagDeg * Math.PI) / 180);
    const atZeroCrossing = run.samples.capacitor[11000];
    expect(Math.abs(atZeroCrossing)).toBeLessThan(steadySine / 2);
  });

  it('drops the capacitor by the breakback, not to zero, when the diac fires', () => {
    const r = sim(0.3, { cycles: 2, stepsPerCycle: 2000, maxPoints: 4001 });
    const firstFiring = r.halfCycles[0].firingAngleDeg as number;
    const k = Math.round((firstFiring / 360) * 2000); // sample index of the firing step
    expect(r.samples.capacitor[k]).toBeGreaterThanOrEqual(32); // the breakover sample
    const after = r.samples.capacitor[k + 6]; // 60 µs later: the dump through the gate is over
    // Settles at breakover − breakback + gate voltage (32 − 6 + 1 V), far from zero.
    expect(after).toBeCloseTo(27, 1);
  });

  it('bounds the returned samples by maxPoints', () => {
    const r = sim(0.3, { cycles: 10, stepsPerCycle: 4000, maxPoints: 500 });
    expect(r.samples.t.length).toBeLessThanOrEqual(500);
    expect(r.samples.supply.length).toBe(r.samples.t.length);
    expect(r.halfCycles).toHaveLength(20);
  });

  it('gives a firing angle that rises with series resistance and stays within 0..180° (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 0.6, noNaN: true }), fc.double({ min: 0.02, max: 0.3, noNaN: true }), (s, ds) => {
        const a1 = sim(s).steadyStateFiringAngleDeg;
        const a2 = sim(Math.min(1, s + ds)).steadyStateFiringAngleDeg;
        fc.pre(a1 !== null && a2 !== null);
        const step = 360 / 2000; // resolution of the fixed step
        return (a1 as number) >= 0 && (a2 as number) <= 180 && (a2 as number) >= (a1 as number) - step;
      }),
      { numRuns: 25 },
    );
  });

  it('does not fire when the breakover is above the supply peak', () => {
    const r = sim(0, { breakoverV: 400 });
    expect(r.steadyStateFiringAngleDeg).toBeNull();
    expect(r.halfCycles.every((h) => h.firingAngleDeg === null)).toBe(true);
  });
});
