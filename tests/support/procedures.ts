import { expect } from 'vitest';
import type { SaveDraftInput } from '../../shared/schemas/procedures.js';
import { DEMO_PASSWORD } from './people.js';

type Agent = { post: Function; put: Function; get: Function } & Record<string, any>;

/** A complete draft: steps with a hold point and cautions, and one checklist of each item kind. */
export function draftBody(overrides: Partial<SaveDraftInput> = {}): SaveDraftInput {
  return {
    title: 'Replacing the triac in a lamp dimmer',
    category: 'dead-work',
    reviewPeriodMonths: 12,
    scope: 'Bench repair of a phase-angle lamp dimmer for 230 V, unit disconnected from the mains.',
    hazards: ['Stored charge in the suppression capacitor', 'Mains voltage if the unit is plugged in by mistake'],
    ppe: ['Safety glasses when desoldering'],
    equipment: ['Two-pole voltage tester to EN 61243-3', 'Proving unit'],
    steps: [
      { text: 'Unplug the unit and keep the plug in sight.', holdPoint: false },
      { text: 'Prove dead across the triac terminals with the two-pole tester, proved before and after on the proving unit.', caution: 'A lamp dimmer can hold charge in its X2 capacitor.', holdPoint: true },
      { text: 'Desolder the triac and fit the replacement of the same or higher rating.', holdPoint: false },
    ],
    checklists: [
      {
        kind: 'self-sign-off',
        title: 'Technician sign-off',
        items: [
          { kind: 'tick', prompt: 'I proved the tester before and after the test.' },
          { kind: 'text', prompt: 'Part number of the replacement triac' },
          { kind: 'evidence', prompt: 'Photo of the finished joint' },
          { kind: 'measurement', prompt: 'Insulation resistance, live conductors to the metal case', unit: 'MΩ', rule: { type: 'preset', presetId: 'insulation-equipment-class-i' } },
          // A self sign-off has no circuit under test, so no computed rule: a fixed range.
          { kind: 'measurement', prompt: 'Output RMS voltage at the set firing angle', unit: 'V', rule: { type: 'range', min: 180, max: 200 } },
          { kind: 'measurement', prompt: 'Supply voltage at the bench socket', unit: 'V', rule: { type: 'range', min: 207, max: 253 } },
        ],
      },
    ],
    ...overrides,
  };
}

let counter = 0;
export const uniqueCode = (prefix = 'T') => `${prefix}-${Date.now().toString(36).toUpperCase()}-${++counter}`;

export async function createDraft(author: Agent, body: Partial<SaveDraftInput> = {}, code = uniqueCode()) {
  const full = draftBody(body);
  const created = await author.post('/api/procedures').send({ code, title: full.title, category: full.category, reviewPeriodMonths: full.reviewPeriodMonths });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  const saved = await author.put(`/api/procedures/${created.body.procedureId}/versions/${created.body.id}`).send(full);
  expect(saved.status, JSON.stringify(saved.body)).toBe(200);
  return { id: created.body.procedureId as string, versionId: created.body.id as string, code, version: saved.body };
}

export async function submitAndApprove(author: Agent, approver: Agent, id: string, versionId: string) {
  const submitted = await author.post(`/api/procedures/${id}/versions/${versionId}/submit`);
  expect(submitted.status, JSON.stringify(submitted.body)).toBe(200);
  const approved = await approver.post(`/api/procedures/${id}/versions/${versionId}/approve`).send({ password: DEMO_PASSWORD });
  expect(approved.status, JSON.stringify(approved.body)).toBe(200);
  return approved.body;
}

export async function publishNew(author: Agent, approver: Agent, body: Partial<SaveDraftInput> = {}, code?: string) {
  const d = await createDraft(author, body, code);
  await submitAndApprove(author, approver, d.id, d.versionId);
  return d;
}

/** The next version: a draft copied from the one in force, changed by `change`, then saved. */
export async function nextDraft(author: Agent, id: string, change: (v: any) => Partial<SaveDraftInput>) {
  const started = await author.post(`/api/procedures/${id}/versions`);
  expect(started.status, JSON.stringify(started.body)).toBe(201);
  const v = started.body;
  const body = {
    title: v.title, category: v.category, reviewPeriodMonths: v.reviewPeriodMonths, scope: v.scope, hazards: v.hazards, ppe: v.ppe,
    equipment: v.equipment, steps: v.steps, checklists: v.checklists.map((c: any) => ({ ...c, id: undefined, items: c.items.map(({ id: _i, ruleText: _r, ...i }: any) => stripNulls(i)) })),
    rereadDays: v.rereadDays, ...stripUndefined(change(v)),
  };
  const saved = await author.put(`/api/procedures/${id}/versions/${v.id}`).send(body);
  expect(saved.status, JSON.stringify(saved.body)).toBe(200);
  return saved.body;
}

function stripNulls(o: Record<string, unknown>) {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== null));
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}
