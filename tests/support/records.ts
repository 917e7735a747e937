import { expect } from 'vitest';
import type { TestApp } from './app.js';
import { DEMO, DEMO_PASSWORD, signIn } from './people.js';
import { draftBody, publishNew } from './procedures.js';
import type { SaveDraftInput } from '../../shared/schemas/procedures.js';
import type { RecordItemView } from '../../shared/practicals/views.js';

type Agent = Awaited<ReturnType<typeof signIn>>;

/** A live-testing procedure with three hold points and one checklist of each kind a record is filled against. */
export function recordsDraft(): Partial<SaveDraftInput> {
  return draftBody({
    title: 'Live test of a phase-angle lamp dimmer behind an isolating transformer',
    category: 'live-testing',
    steps: [
      { text: 'Connect the unit under test to the isolating transformer output, with the bench RCD ahead of it.', holdPoint: false },
      { text: 'Press the RCD test button and prove the bench RCD trips.', holdPoint: true },
      { text: 'Apply power, set the potentiometer and measure the output with the differential probe.', caution: 'Never clip an earthed probe to the phase-cut output.', holdPoint: true },
      { text: 'Switch off, isolate and prove dead before disconnecting.', holdPoint: true },
    ],
    checklists: [
      {
        kind: 'self-sign-off', title: 'Technician sign-off',
        items: [
          { kind: 'tick', prompt: 'I proved the voltage tester before and after use.' },
          { kind: 'text', prompt: 'Serial number of the unit tested' },
          { kind: 'measurement', prompt: 'Supply voltage at the bench socket', unit: 'V', rule: { type: 'range', min: 207, max: 253 } },
          { kind: 'evidence', prompt: 'Photo of the test set-up' },
        ],
      },
      {
        kind: 'practical-assessment', title: 'Assessor checklist',
        items: [
          { kind: 'tick', prompt: 'The technician proved dead before touching the unit.' },
          { kind: 'measurement', prompt: 'Firing angle read from the oscilloscope', unit: '°', rule: { type: 'computed', quantity: 'firing-angle', tolerance: { mode: 'absolute', value: 5 } } },
          { kind: 'measurement', prompt: 'Output RMS voltage', unit: 'V', rule: { type: 'computed', quantity: 'output-rms-voltage', tolerance: { mode: 'relative', percent: 5 } } },
          { kind: 'measurement', prompt: 'Bench RCD break time at 1×IΔn', unit: 'ms', rule: { type: 'preset', presetId: 'rcd-30ma-1x' } },
        ],
      },
      {
        kind: 'bench-pre-use', title: 'Bench pre-use check',
        items: [
          { kind: 'tick', prompt: 'Emergency stop pressed and released; the bench came back only on reset.' },
          { kind: 'measurement', prompt: 'Bench RCD break time at 1×IΔn', unit: 'ms', rule: { type: 'preset', presetId: 'rcd-30ma-1x' } },
        ],
      },
    ],
  });
}

/** Publishes the procedure (a manager writes it, another approves it) and returns its version as served. */
export async function publishRecordsProcedure(t: TestApp, code?: string) {
  const author = await signIn(t, DEMO.manager);
  const approver = await signIn(t, DEMO.manager2);
  const { id, versionId } = await publishNew(author, approver, recordsDraft(), code);
  const version = (await author.get(`/api/procedures/${id}/versions/${versionId}`)).body;
  const list = (kind: string) => version.checklists.find((c: { kind: string }) => c.kind === kind);
  return { id, versionId, version, selfSignOff: list('self-sign-off'), practical: list('practical-assessment'), preUse: list('bench-pre-use') };
}

/** 100 W, 230 V heater (529 Ω); a DB3-like diac and a small triac; the RC network from the calculator's example. */
export const CIRCUIT = {
  load: { kind: 'resistance', ohms: 529 },
  trigger: {
    fixedResistanceOhms: 3300, potentiometerOhms: 470_000, setting: 0.3, capacitanceF: 100e-9, breakoverV: 32, breakbackV: 6,
    latchingCurrentA: 0.04, holdingCurrentA: 0.025, gateTriggerCurrentA: 0.025, gateTriggerVoltageV: 1,
  },
  thermal: { thresholdVoltageV: 1.1, slopeResistanceOhms: 0.05, rthJunctionCaseKW: 3, rthCaseSinkKW: 0.5, rthSinkAmbientKW: 20, ambientC: 25, maxJunctionC: 125 },
};

export async function lookups(agent: Agent) {
  const benches: Record<string, string> = {};
  const instruments: Record<string, string> = {};
  for (const b of (await agent.get('/api/benches').query({ pageSize: 100 })).body.items) benches[b.code] = b.id;
  for (const i of (await agent.get('/api/instruments').query({ pageSize: 100 })).body.items) instruments[i.serial] = i.id;
  return { benches, instruments };
}

export async function acknowledge(agent: Agent, id: string, versionId: string) {
  const res = await agent.post(`/api/procedures/${id}/versions/${versionId}/acknowledge`).send({ password: DEMO_PASSWORD });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
}

export const itemByPrompt = (record: { items: RecordItemView[] }, start: string): RecordItemView & { entry: any } => {
  const item = record.items.find((i) => i.prompt.startsWith(start));
  if (!item) throw new Error(`no item starting "${start}"`);
  return item;
};
