import { describe, it, expect } from 'vitest';
import {
  inductiveInputSchema, limitCheckInputSchema, ratingsInputSchema, resistiveInputSchema, thermalInputSchema, triggerInputSchema,
} from '../../../shared/schemas/engine';

const supply = { voltageRms: 230, frequencyHz: 50 };
const resistive = { supply, load: { kind: 'resistance', ohms: 52.9 }, alphaDeg: 90 };
const trigger = {
  supply, loadOhms: 529, fixedResistanceOhms: 3300, potentiometerOhms: 470e3, setting: 0.3, capacitanceF: 100e-9,
  diac: { breakoverV: 32, breakbackV: 6 },
  device: { latchingCurrentA: 0.04, holdingCurrentA: 0.025, gateTriggerCurrentA: 0.025, gateTriggerVoltageV: 1 },
};

/** The joined paths of every issue, e.g. ["supply.frequencyHz"]. */
const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  (r.error?.issues ?? []).map((i) => i.path.map(String).join('.'));

describe('engine input schemas', () => {
  it('accepts a valid resistive input and applies defaults', () => {
    const r = resistiveInputSchema.safeParse(resistive);
    expect(r.success).toBe(true);
    expect(r.data).toMatchObject({ waveform: false, samples: 400, waveformCycles: 2 });
  });

  it('refuses NaN (zod 4 z.number() refuses it) naming the field', () => {
    const r = resistiveInputSchema.safeParse({ ...resistive, alphaDeg: Number.NaN });
    expect(r.success).toBe(false);
    expect(paths(r)).toEqual(['alphaDeg']);
  });

  it('refuses Infinity naming the field', () => {
    const r = resistiveInputSchema.safeParse({ ...resistive, supply: { ...supply, voltageRms: Number.POSITIVE_INFINITY } });
    expect(r.success).toBe(false);
    expect(paths(r)).toEqual(['supply.voltageRms']);
  });

  it('refuses a negative resistance naming the field', () => {
    const r = resistiveInputSchema.safeParse({ ...resistive, load: { kind: 'resistance', ohms: -10 } });
    expect(paths(r)).toEqual(['load.ohms']);
    expect(paths(inductiveInputSchema.safeParse({ supply, resistanceOhms: -1, inductanceH: 0.1, alphaDeg: 30 }))).toEqual(['resistanceOhms']);
  });

  it('refuses 80 Hz (outside 40–70 Hz) naming the field', () => {
    const r = resistiveInputSchema.safeParse({ ...resistive, supply: { ...supply, frequencyHz: 80 } });
    expect(paths(r)).toEqual(['supply.frequencyHz']);
  });

  it('refuses α = 200° naming the field', () => {
    expect(paths(resistiveInputSchema.safeParse({ ...resistive, alphaDeg: 200 }))).toEqual(['alphaDeg']);
  });

  it('accepts a trigger input with simulation defaults, and refuses breakback above breakover or a setting of 1.5', () => {
    const ok = triggerInputSchema.safeParse(trigger);
    expect(ok.success).toBe(true);
    expect(ok.data?.simulation).toEqual({ cycles: 6, stepsPerCycle: 4000 });
    expect(paths(triggerInputSchema.safeParse({ ...trigger, diac: { breakoverV: 32, breakbackV: 40 } }))).toEqual(['diac.breakbackV']);
    expect(paths(triggerInputSchema.safeParse({ ...trigger, setting: 1.5 }))).toEqual(['setting']);
    expect(paths(triggerInputSchema.safeParse({ ...trigger, capacitanceF: 0 }))).toEqual(['capacitanceF']);
    // No fixed resistor and the pot at zero would put the capacitor straight across the supply.
    expect(paths(triggerInputSchema.safeParse({ ...trigger, fixedResistanceOhms: 0, setting: 0 }))).toEqual(['fixedResistanceOhms']);
    expect(triggerInputSchema.safeParse({ ...trigger, fixedResistanceOhms: 0, setting: 0.1 }).success).toBe(true);
  });

  it('bounds the waveform request: at most 4000 samples over one or two cycles, and waveform must be a boolean', () => {
    expect(paths(resistiveInputSchema.safeParse({ ...resistive, waveform: true, samples: 5000 }))).toEqual(['samples']);
    expect(paths(resistiveInputSchema.safeParse({ ...resistive, waveform: true, waveformCycles: 3 }))).toEqual(['waveformCycles']);
    expect(paths(resistiveInputSchema.safeParse({ ...resistive, waveform: 'yes' }))).toEqual(['waveform']);
    expect(paths(triggerInputSchema.safeParse({ ...trigger, samples: 2.5 }))).toEqual(['samples']);
  });

  it('takes a number or "did-not-trip" as a limit reading, and refuses a negative one or other words', () => {
    expect(limitCheckInputSchema.safeParse({ presetId: 'rcd-30ma-half', measured: 'did-not-trip' }).success).toBe(true);
    expect(limitCheckInputSchema.safeParse({ presetId: 'rcd-30ma-1x', measured: 24 }).success).toBe(true);
    expect(paths(limitCheckInputSchema.safeParse({ presetId: 'rcd-30ma-1x', measured: -3 }))).toEqual(['measured']);
    expect(paths(limitCheckInputSchema.safeParse({ presetId: 'rcd-30ma-1x', measured: 'tripped' }))).toEqual(['measured']);
  });

  it('refuses an RMS current below the average current in the thermal input', () => {
    const r = thermalInputSchema.safeParse({
      thresholdVoltageV: 1, slopeResistanceOhms: 0.03, averageCurrentA: 5, rmsCurrentA: 4, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.5, ambientC: 40, maxJunctionC: 125,
    });
    expect(paths(r)).toEqual(['rmsCurrentA']);
  });

  it('refuses a supply above 1000 V in the ratings input', () => {
    const r = ratingsInputSchema.safeParse({ supply: { voltageRms: 1200, frequencyHz: 50 }, loadCurrentA: 4, vdrmV: 800 });
    expect(paths(r)).toEqual(['supply.voltageRms']);
  });
});
