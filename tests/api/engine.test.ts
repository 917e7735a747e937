import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';

let t: TestApp;
let tech: Awaited<ReturnType<typeof signIn>>;
beforeAll(async () => {
  t = await makeTestApp();
  tech = await signIn(t, DEMO.technician);
});

// Rashid, Power Electronics: Devices, Circuits, and Applications, 4th ed., Example 11.1: 120 V, 60 Hz, R = 10 Ω, α = 90°.
const rashid = { supply: { voltageRms: 120, frequencyHz: 60 }, load: { kind: 'resistance', ohms: 10 }, alphaDeg: 90 };
const trigger = {
  supply: { voltageRms: 230, frequencyHz: 50 }, loadOhms: 529, fixedResistanceOhms: 3300, potentiometerOhms: 470e3, setting: 0.3, capacitanceF: 100e-9,
  diac: { breakoverV: 32, breakbackV: 6 }, device: { latchingCurrentA: 0.04, holdingCurrentA: 0.025, gateTriggerCurrentA: 0.025, gateTriggerVoltageV: 1 },
};

describe('engine API: resistive load and its inverse', () => {
  it('when Rashid 4th ed. Example 11.1 is posted, then the book’s figures come back', async () => {
    const res = await tech.post('/api/engine/resistive').send(rashid);
    expect(res.status).toBe(200);
    expect(res.body.outputVrms).toBeCloseTo(84.85, 2); // Rashid 4th ed. Ex. 11.1: Vo = 84.85 V
    expect(res.body.powerFactor).toBeCloseTo(0.707, 3); // Rashid 4th ed. Ex. 11.1: PF = 0.707
    expect(res.body.perDirectionDevice.averageA).toBeCloseTo(2.7, 2); // Rashid 4th ed. Ex. 11.1: I_A = 2.70 A
    expect(res.body.perDirectionDevice.rmsA).toBeCloseTo(6.0, 2); // Rashid 4th ed. Ex. 11.1: I_R = 6.0 A
    expect(res.body.waveform).toBeNull();
  });

  it('when the waveform is asked for, then that many samples of two cycles come back with a firing point per half-cycle', async () => {
    const res = await tech.post('/api/engine/resistive').send({ ...rashid, waveform: true, samples: 240 });
    expect(res.status).toBe(200);
    expect(res.body.waveform.t).toHaveLength(240);
    expect(res.body.waveform.t.at(-1)).toBeCloseTo(2 / 60, 12); // two 60 Hz cycles (definition)
    expect(res.body.waveform.firingPoints.map((p: { angleDeg: number }) => p.angleDeg)).toEqual([90, 90, 90, 90]);
  });

  it('when half of full power is the target, then the firing angle is 90° (common practice)', async () => {
    const res = await tech.post('/api/engine/inverse').send({ ...rashid, alphaDeg: undefined, target: { kind: 'fraction', value: 0.5 } });
    expect(res.status).toBe(200);
    expect(res.body.alphaDeg).toBeCloseTo(90, 5);
    expect(res.body.fullPowerW).toBeCloseTo(1440, 9); // 120² / 10 (arithmetic)
  });

  it('when the target power is above full power, then 422 names target.watts and says what can be delivered', async () => {
    const res = await tech.post('/api/engine/inverse').send({ ...rashid, target: { kind: 'power', watts: 2000 } });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('engine_input');
    expect(Object.keys(res.body.error.fields)).toEqual(['target.watts']);
    expect(res.body.error.fields['target.watts']).toMatch(/0 to 1440\.000 W/);
  });
});

describe('engine API: refusing bad input, naming the field', () => {
  // The wording is the plain one from shared/schemas/messages.ts; '' where the schema words it itself.
  const cases: [string, string, unknown, string, string][] = [
    ['a voltage given as a string', '/api/engine/resistive', { ...rashid, supply: { voltageRms: '120', frequencyHz: 60 } }, 'supply.voltageRms', 'must be a number'],
    ['a negative resistance', '/api/engine/resistive', { ...rashid, load: { kind: 'resistance', ohms: -10 } }, 'load.ohms', 'must be more than 0'],
    ['an 80 Hz supply (outside 40–70 Hz)', '/api/engine/resistive', { ...rashid, supply: { voltageRms: 120, frequencyHz: 80 } }, 'supply.frequencyHz', 'must be at most 70'],
    ['a firing angle of 200°', '/api/engine/resistive', { ...rashid, alphaDeg: 200 }, 'alphaDeg', 'must be at most 180'],
    ['5000 waveform samples (more than 4000)', '/api/engine/resistive', { ...rashid, waveform: true, samples: 5000 }, 'samples', 'must be at most 4000'],
    ['a missing firing angle', '/api/engine/resistive', { ...rashid, alphaDeg: undefined }, 'alphaDeg', 'is required'],
    ['a negative inductance', '/api/engine/inductive', { supply: rashid.supply, resistanceOhms: 20, inductanceH: -0.05, alphaDeg: 90 }, 'inductanceH', 'must be at least 0'],
    ['a potentiometer setting of 1.5', '/api/engine/trigger', { ...trigger, setting: 1.5 }, 'setting', 'must be at most 1'],
    ['a breakback above the breakover', '/api/engine/trigger', { ...trigger, diac: { breakoverV: 32, breakbackV: 40 } }, 'diac.breakbackV', ''],
    ['a limit reading given as a word other than did-not-trip', '/api/engine/limit-check', { presetId: 'rcd-30ma-1x', measured: 'tripped' }, 'measured', ''],
    ['a negative limit reading', '/api/engine/limit-check', { presetId: 'rcd-30ma-1x', measured: -5 }, 'measured', ''],
  ];
  for (const [what, url, body, field, wording] of cases) {
    it(`when ${what} is sent, then 400 names ${field}`, async () => {
      const res = await tech.post(url).send(body as object);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(Object.keys(res.body.error.fields)).toContain(field);
      if (wording) {
        expect(res.body.error.fields[field]).toBe(wording);
        expect(res.body.error.message).toBe(`${field}: ${wording}`);
      }
    });
  }

  it('when the body is not JSON, then 400 says so', async () => {
    const res = await tech.post('/api/engine/resistive').set('Content-Type', 'application/json').send('{"supply": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });

  it('when the fuse would need more than the largest IEC 60269 rating listed (125 A, from memory), then 422 names loadCurrentA', async () => {
    const res = await tech.post('/api/engine/ratings').send({ supply: rashid.supply, loadCurrentA: 110, vdrmV: 600, fuseSeries: 'IEC60269' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['loadCurrentA']);
  });

  it('when signed out, then a calculation and the presets answer 401', async () => {
    expect((await t.request().post('/api/engine/resistive').send(rashid)).status).toBe(401);
    expect((await t.request().get('/api/engine/limit-presets')).status).toBe(401);
  });
});

describe('engine API: the other modes', () => {
  it('when a trigger network is posted, then the simulated angle is the expectation and the estimate comes labelled', async () => {
    const res = await tech.post('/api/engine/trigger').send({ ...trigger, waveform: true, samples: 300 });
    expect(res.status).toBe(200);
    expect(res.body.firesInSteadyState).toBe(true);
    expect(res.body.expectedFiringAngleDeg).toBeGreaterThan(0);
    expect(res.body.expectedFiringAngleDeg).toBeLessThan(180);
    expect(res.body.estimate.estimate).toBe(true);
    expect(res.body.waveform.t.length).toBeLessThanOrEqual(300);
    expect(res.body.waveform.firingPoints).toHaveLength(4);
  });

  it('when a universal motor is posted, then it is flagged as not modelled and no figures are given', async () => {
    const res = await tech.post('/api/engine/inductive').send({ supply: rashid.supply, resistanceOhms: 20, inductanceH: 0.05, alphaDeg: 90, loadKind: 'universal-motor' });
    expect(res.status).toBe(200);
    expect(res.body.loadModel).toMatchObject({ modelled: false, estimate: true });
    expect(res.body.figures).toBeNull();
  });

  // Sedra & Smith, Microelectronic Circuits, 5th ed., heat-sink example (from memory): 19.7 W through 3 + 0.6 + 4 °C/W at 25 °C → 175 °C.
  it('when the Sedra & Smith heat-sink example is posted, then the junction sits at its 175 °C limit (from memory)', async () => {
    const p = 150 / 7.6;
    const res = await tech.post('/api/engine/thermal').send({
      thresholdVoltageV: 1, slopeResistanceOhms: 0, averageCurrentA: p, rmsCurrentA: p, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.6, rthSinkAmbientKW: 4, ambientC: 25, maxJunctionC: 175,
    });
    expect(res.status).toBe(200);
    expect(res.body.junctionC).toBeCloseTo(175, 9);
  });

  // IEC 61008-1 / 61009-1 (from memory): no trip at 0.5×IΔn.
  it('when the 0.5×IΔn RCD test did not trip, then it passes; when it tripped at 120 ms, then it fails', async () => {
    const held = await tech.post('/api/engine/limit-check').send({ presetId: 'rcd-30ma-half', measured: 'did-not-trip' });
    expect(held.status).toBe(200);
    expect(held.body).toMatchObject({ pass: true, rule: 'no trip within 300 ms' });
    const tripped = await tech.post('/api/engine/limit-check').send({ presetId: 'rcd-30ma-half', measured: 120 });
    expect(tripped.body.pass).toBe(false);
  });

  it('when "did not trip" is given for an insulation reading or the preset is unknown, then 422 names the field', async () => {
    const word = await tech.post('/api/engine/limit-check').send({ presetId: 'insulation-equipment-class-i', measured: 'did-not-trip' });
    expect(word.status).toBe(422);
    expect(Object.keys(word.body.error.fields)).toEqual(['measured']);
    const unknown = await tech.post('/api/engine/limit-check').send({ presetId: 'no-such-preset', measured: 3 });
    expect(unknown.status).toBe(422);
    expect(Object.keys(unknown.body.error.fields)).toEqual(['presetId']);
  });

  // IET Code of Practice per-metre values (from memory): 1.0 mm² ≈ 19.5 mΩ/m, plus the 0.1 Ω allowance.
  it('when a 2 m lead of 1 mm² is posted with 0.12 Ω measured, then the limit is 0.139 Ω and it passes (IET CoP, from memory)', async () => {
    const res = await tech.post('/api/engine/earth-continuity').send({ lengthM: 2, csaMm2: 1, measuredOhm: 0.12 });
    expect(res.status).toBe(200);
    expect(res.body.preset.value).toBeCloseTo(0.139, 12);
    expect(res.body.verdict.pass).toBe(true);
  });

  it('when the presets are read, then each carries a standard, an edition and a table, and the RCD half test is a no-trip rule', async () => {
    const res = await tech.get('/api/engine/limit-presets');
    expect(res.status).toBe(200);
    for (const p of res.body.presets) expect(Object.keys(p.source).sort()).toEqual(['edition', 'standard', 'table']);
    expect(res.body.presets.find((p: { id: string }) => p.id === 'rcd-30ma-half')).toMatchObject({ comparison: 'no-trip', testDurationMs: 300 });
    expect(res.body.earthContinuity.allowanceOhm).toBe(0.1); // IET CoP allowance (from memory)
  });
});
