import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { CIRCUIT, itemByPrompt, lookups, publishRecordsProcedure } from '../support/records.js';

// The technician signs on the assessor's tablet: their guesses count against their own account, not the assessor's.
let t: TestApp;
let assessor: Awaited<ReturnType<typeof signIn>>;
let practicalId: string;
let technicianId: string;

beforeAll(async () => {
  t = await makeTestApp();
  assessor = await signIn(t, DEMO.assessor);
  technicianId = (await signIn(t, DEMO.technician)).user.id;
  const proc = await publishRecordsProcedure(t);
  const ids = await lookups(assessor);
  const meter = ids.instruments['OW61-20417'];
  const p = (await assessor.post('/api/practicals').send({
    technicianId, benchId: ids.benches['LEJ-B1'], procedureId: proc.id, versionId: proc.versionId, instrumentIds: [meter], circuit: CIRCUIT,
  })).body;
  practicalId = p.id;
  const put = (prompt: string, body: object) => assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, prompt).id}`).send(body);
  for (const h of p.holdPoints) await assessor.post(`/api/practicals/${p.id}/hold-points/${h.stepKey}`).send({});
  await put('The technician proved dead', { checked: true });
  await put('Firing angle', { value: 74, unit: '°', instrumentId: ids.instruments['BL70-5531'] });
  await put('Output RMS voltage', { value: 188, unit: 'V', instrumentId: meter });
  await put('Bench RCD', { value: 22, unit: 'ms', instrumentId: ids.instruments['TF3-11902'] });
  const assessed = await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'competent', comment: 'Safe and methodical.', password: DEMO_PASSWORD });
  expect(assessed.status, JSON.stringify(assessed.body)).toBe(200);
});

const acknowledge = (password: string) => assessor.post(`/api/practicals/${practicalId}/acknowledge`).send({ technician: DEMO.technician, password });
const signatures = async () => (await t.ownerQuery(`select meaning from signatures where entity = 'practical' and entity_id = $1 order by signed_at`, [practicalId])).rows.map((r) => r.meaning);

describe('the technician’s signature on the assessor’s tablet', () => {
  it('when the technician’s password is guessed N times, then the technician is locked, nothing is acknowledged, and the assessor is not', async () => {
    const N = t.config.signIn.lockoutThreshold;
    for (let i = 1; i < N; i++) expect((await acknowledge(`guess ${i}`)).body.error.fields).toEqual({ password: 'the password is not right' });
    const locked = await acknowledge(`guess ${N}`);
    expect(locked.status).toBe(401);
    expect(locked.body.error.code).toBe('locked');
    expect(locked.body.error.fields.password).toBe('this account is locked for 15 more minute(s) after too many wrong passwords');
    expect((await acknowledge(DEMO_PASSWORD)).body.error.code).toBe('locked');
    expect((await t.request().post('/api/session').send({ email: DEMO.technician, password: DEMO_PASSWORD })).body.error.code).toBe('locked');
    expect(await signatures()).toEqual(['assessed']);
    expect((await assessor.get(`/api/practicals/${practicalId}`)).body.status).toBe('assessed');
    // The assessor is still signed in and their own account is not locked.
    expect((await assessor.get('/api/session')).status).toBe(200);
    expect((await t.request().post('/api/session').send({ email: DEMO.assessor, password: DEMO_PASSWORD })).status).toBe(200);

    t.clock.advance(t.config.signIn.lockoutMs + 1000);
    const ack = await acknowledge(DEMO_PASSWORD);
    expect(ack.status, JSON.stringify(ack.body)).toBe(200);
    expect(await signatures()).toEqual(['assessed', 'outcome acknowledged']);
  });
});
