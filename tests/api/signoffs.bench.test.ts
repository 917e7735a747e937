import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { CIRCUIT, itemByPrompt, publishRecordsProcedure } from '../support/records.js';

let t: TestApp;
let tech: Awaited<ReturnType<typeof signIn>>;
let manager: Awaited<ReturnType<typeof signIn>>;
let proc: Awaited<ReturnType<typeof publishRecordsProcedure>>;
let benchId: string;

beforeAll(async () => {
  t = await makeTestApp();
  [tech, manager] = [await signIn(t, DEMO.technician), await signIn(t, DEMO.manager)];
  proc = await publishRecordsProcedure(t);
  const bench = await manager.post('/api/benches').send({
    siteId: tech.user.site.id, code: 'LEJ-B7', name: 'Spare dimmer bench', supplyVoltage: 230, supplyFrequency: 50, isolatingTransformer: true,
    isolatingTransformerVa: 800, rcdType: 'A', rcdRatedResidualMa: 30, emergencyStop: true, nextInspectionOn: '2026-09-30',
  });
  benchId = bench.body.id;
});

async function preUseCheck(breakMs: number) {
  const s = (await tech.post('/api/signoffs').send({ procedureId: proc.id, versionId: proc.versionId, checklistId: proc.preUse.id, benchId })).body;
  expect(s).toMatchObject({ kind: 'bench-pre-use', bench: { code: 'LEJ-B7' }, status: 'in_progress' });
  await tech.put(`/api/signoffs/${s.id}/items/${itemByPrompt(s, 'Emergency stop').id}`).send({ checked: true });
  await tech.put(`/api/signoffs/${s.id}/items/${itemByPrompt(s, 'Bench RCD').id}`).send({ value: breakMs, unit: 'ms' });
  return s;
}

describe('bench pre-use checks filled in from the checklist', () => {
  it('when a pre-use check is opened without a bench, or a self sign-off with one, then the field is named', async () => {
    const noBench = await tech.post('/api/signoffs').send({ procedureId: proc.id, versionId: proc.versionId, checklistId: proc.preUse.id });
    expect(noBench.body.error.fields).toEqual({ benchId: 'choose the bench this check is for' });
    const withBench = await tech.post('/api/signoffs').send({ procedureId: proc.id, versionId: proc.versionId, checklistId: proc.selfSignOff.id, benchId });
    expect(withBench.body.error.fields).toEqual({ benchId: 'leave empty for a self sign-off' });
    const practicalList = await tech.post('/api/signoffs').send({ procedureId: proc.id, versionId: proc.versionId, checklistId: proc.practical.id });
    expect(practicalList.status).toBe(422);
  });

  it('when a reading fails, then it is recorded only on confirmation, as the bench’s latest (failed) check, and the bench is refused for practicals', async () => {
    const s = await preUseCheck(350);
    const unconfirmed = await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: DEMO_PASSWORD });
    expect(unconfirmed.status).toBe(422);
    expect(unconfirmed.body.error.fields).toHaveProperty('recordAsFailed');
    const recorded = await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: DEMO_PASSWORD, recordAsFailed: true });
    expect(recorded.body).toMatchObject({ status: 'recorded', passed: false });
    const checks = (await manager.get(`/api/benches/${benchId}/pre-use-checks`)).body.items;
    expect(checks[0]).toMatchObject({ passed: false, checklistResponseId: s.id, id: recorded.body.benchCheckId });
    expect(checks[0].notes).toContain('Bench RCD break time at 1×IΔn');
    expect(checks[0].signatures[0]).toMatchObject({ printedName: 'Tomasz Wójcik', meaning: 'pre-use check carried out as recorded' });
    const assessor = await signIn(t, DEMO.assessor);
    const refused = await assessor.post('/api/practicals').send({ technicianId: tech.user.id, benchId, procedureId: proc.id, versionId: proc.versionId, circuit: CIRCUIT });
    expect(refused.status).toBe(409);
    expect(refused.body.error.fields.preUseCheck).toMatch(/^bench LEJ-B7 failed its latest pre-use check on 2026-03-02/);
  });

  it('when a later check passes, then the bench is usable again and nobody countersigns a pre-use check', async () => {
    t.clock.set('2026-03-02T12:00:00Z');
    const s = await preUseCheck(24);
    const passed = await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: DEMO_PASSWORD });
    expect(passed.body).toMatchObject({ status: 'recorded', passed: true, notes: null });
    expect((await manager.get(`/api/benches/${benchId}/usability`)).status).toBe(200);
    const assessor = await signIn(t, DEMO.assessor);
    expect((await assessor.post(`/api/signoffs/${s.id}/countersign`).send({ password: DEMO_PASSWORD })).status).toBe(409);
  });
});

describe('lists of sign-offs, paged and filtered on the server', () => {
  it('when a technician lists their own, then only theirs come back; a manager of another site sees none of them', async () => {
    // Filtered to this file's procedure: the demo seed has sign-offs of its own.
    const other = await signIn(t, DEMO.technician2);
    await other.post('/api/signoffs').send({ procedureId: proc.id, versionId: proc.versionId, checklistId: proc.selfSignOff.id });
    const mine = (await tech.get('/api/signoffs').query({ pageSize: 2, q: proc.version.code })).body;
    expect(mine).toMatchObject({ total: 2, page: 1, pageSize: 2 });
    expect(mine.items.every((r: { personName: string }) => r.personName === 'Tomasz Wójcik')).toBe(true);
    expect((await tech.get('/api/signoffs').query({ view: 'site', kind: 'bench-pre-use', status: 'recorded', q: proc.version.code })).body.total).toBe(2);
    expect((await tech.get('/api/signoffs').query({ view: 'site', q: proc.version.code })).body.total).toBe(2);
    const siteWide = (await manager.get('/api/signoffs').query({ view: 'site', q: proc.version.code })).body;
    expect(siteWide.total).toBe(3);
    const manager2 = await signIn(t, DEMO.manager2);
    expect((await manager2.get('/api/signoffs').query({ view: 'site', q: proc.version.code })).body.total).toBe(0);
    expect((await manager2.get(`/api/signoffs/${mine.items[0].id}`)).status).toBe(403);
  });
});
