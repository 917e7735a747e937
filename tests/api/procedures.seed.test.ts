import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { isAtLeast } from '../../shared/procedures/change-class.js';

let t: TestApp;
type Agent = Awaited<ReturnType<typeof signIn>>;
let manager: Agent, tech: Agent;

beforeAll(async () => {
  t = await makeTestApp();
  [manager, tech] = await Promise.all([signIn(t, DEMO.manager), signIn(t, DEMO.technician)]);
});

describe('demo procedures', () => {
  it('when the demo is seeded, then its procedures are listed with their versions, an overdue review and one waiting for approval', async () => {
    const res = await manager.get('/api/procedures').query({ q: 'BO-' });
    const byCode = Object.fromEntries(res.body.items.map((r: { code: string }) => [r.code, r]));
    expect(Object.keys(byCode)).toEqual(['BO-FF-03', 'BO-HTR-04', 'BO-ISO-01', 'BO-LIVE-02']);
    expect(byCode['BO-ISO-01']).toMatchObject({ status: 'published', versionNumber: 2, reviewOverdue: false });
    expect(byCode['BO-FF-03']).toMatchObject({ status: 'published', reviewOverdue: true, ownerName: 'Dana Whitcombe' });
    expect(byCode['BO-HTR-04']).toMatchObject({ status: 'in_review', publishedNumber: null });
    const history = await manager.get(`/api/procedures/${byCode['BO-ISO-01'].id}`);
    expect(history.body.versions.map((v: { status: string }) => v.status)).toEqual(['published', 'superseded']);
  });

  it('when a technician who read version 1 opens the list, then the re-read is due, and acknowledging clears it', async () => {
    const mine = (await tech.get('/api/procedures').query({ q: 'BO-ISO-01' })).body.items[0];
    expect(mine).toMatchObject({ myState: 're-read-due', publishedNumber: 2 });
    expect((await tech.get('/api/procedures').query({ q: 'BO-HTR' })).body.items).toEqual([]);
    const ack = await tech.post(`/api/procedures/${mine.id}/versions/${mine.publishedVersionId}/acknowledge`).send({ password: DEMO_PASSWORD });
    expect(ack.status).toBe(201);
    expect((await tech.get('/api/procedures').query({ q: 'BO-ISO-01' })).body.items[0].myState).toBe('acknowledged');
  });

  it('when each seeded version is opened, then it is complete and its change class meets what its steps require', async () => {
    const { items } = (await manager.get('/api/procedures').query({ q: 'BO-' })).body;
    for (const row of items) {
      const history = (await manager.get(`/api/procedures/${row.id}`)).body;
      for (const summary of history.versions) {
        const v = (await manager.get(`/api/procedures/${row.id}/versions/${summary.id}`)).body;
        expect(v.steps.length, v.code).toBeGreaterThan(2);
        expect(v.checklists.length, v.code).toBeGreaterThan(0);
        expect(v.steps.some((s: { holdPoint: boolean }) => s.holdPoint), v.code).toBe(true);
        if (v.changeCheck) expect(isAtLeast(v.changeClass, v.changeCheck.minimum), `${v.code} v${v.number}`).toBe(true);
        if (v.status === 'published' || v.status === 'superseded') expect(v.approval.meaning).toBe('approved for use');
      }
    }
  });

  it('when the draft waiting for review is approved by the other manager, then it publishes', async () => {
    const row = (await manager.get('/api/procedures').query({ q: 'BO-HTR-04' })).body.items[0];
    const res = await manager.post(`/api/procedures/${row.id}/versions/${row.versionId}/approve`).send({ password: DEMO_PASSWORD });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.approval.printedName).toBe('Jörg Łukasik');
  });
});
