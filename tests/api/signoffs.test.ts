import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { acknowledge, itemByPrompt, publishRecordsProcedure } from '../support/records.js';
import { makePng } from '../fixtures/evidence-files.js';

let t: TestApp;
let tech: Awaited<ReturnType<typeof signIn>>;
let assessor: Awaited<ReturnType<typeof signIn>>;
let proc: Awaited<ReturnType<typeof publishRecordsProcedure>>;

beforeAll(async () => {
  t = await makeTestApp();
  [tech, assessor] = [await signIn(t, DEMO.technician), await signIn(t, DEMO.assessor)];
  proc = await publishRecordsProcedure(t);
});

type Agent = typeof tech;
async function openSignoff(agent: Agent) {
  const res = await agent.post('/api/signoffs').send({ procedureId: proc.id, versionId: proc.versionId, checklistId: proc.selfSignOff.id });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}
const put = (agent: Agent, s: { id: string }, prompt: string, body: Record<string, unknown>) =>
  agent.put(`/api/signoffs/${s.id}/items/${itemByPrompt(s as never, prompt).id}`).send(body);
async function upload(agent: Agent, s: { id: string }) {
  const res = await agent.post('/api/evidence').field('entity', 'signoff').field('entityId', s.id).attach('file', makePng(), 'set-up.png');
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as string;
}
async function complete(agent: Agent, s: { id: string }, volts = 231) {
  await put(agent, s, 'I proved', { checked: true });
  await put(agent, s, 'Serial number', { text: 'DIM-2291' });
  await put(agent, s, 'Supply voltage', { value: volts, unit: 'V' });
  return put(agent, s, 'Photo of the test set-up', { evidenceId: await upload(agent, s) });
}

describe('self sign-offs', () => {
  it('when items are filled in any order, then each is saved as made and the progress shows on resuming', async () => {
    const s = await openSignoff(tech);
    expect(s.progress).toEqual({ done: 0, total: 4 });
    expect((await put(tech, s, 'Serial number', { text: 'DIM-2291' })).status).toBe(200);
    await put(tech, s, 'I proved', { checked: true });
    const resumed = (await tech.get(`/api/signoffs/${s.id}`)).body;
    expect(resumed.progress).toEqual({ done: 2, total: 4 });
    expect(itemByPrompt(resumed, 'Serial number')).toMatchObject({ entry: { text: 'DIM-2291', recordedByName: 'Tomasz Wójcik' }, problem: null });
    expect(itemByPrompt(resumed, 'Photo').problem).toBe('needs an upload');
    expect((await put(tech, s, 'Serial number', { checked: true })).body.error.fields).toEqual({ text: 'write the answer' });
  });

  it('when a required item fails its rule, then the submission is refused naming that item and nothing is signed', async () => {
    const s = await openSignoff(tech);
    await complete(tech, s, 260);
    const res = await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: DEMO_PASSWORD });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual({ [`items.${itemByPrompt(s, 'Supply voltage').id}`]: '3. Supply voltage at the bench socket: the reading is outside the acceptance rule' });
    expect((await tech.get(`/api/signoffs/${s.id}`)).body).toMatchObject({ status: 'in_progress', signatures: [] });
  });

  it('when an evidence item names a file of another record, then it is refused', async () => {
    const [a, b] = [await openSignoff(tech), await openSignoff(tech)];
    const res = await put(tech, b, 'Photo', { evidenceId: await upload(tech, a) });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.evidenceId).toBe('that file was not uploaded to this record');
  });

  it('when complete and signed, then it waits for a countersignature, refuses edits (409, in the database too) and its evidence is kept', async () => {
    const s = await openSignoff(tech);
    await complete(tech, s);
    expect((await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: 'wrong-password' })).status).toBe(422);
    const signed = await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: DEMO_PASSWORD });
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);
    expect(signed.body).toMatchObject({ status: 'submitted', signatures: [{ printedName: 'Tomasz Wójcik', meaning: 'completed as recorded' }] });
    expect((await put(tech, s, 'Serial number', { text: 'changed' })).status).toBe(409);
    await expect(t.deps.pool.query("update signoff_entries set text = 'changed' where signoff_id = $1", [s.id])).rejects.toThrow(/record is signed/);
    await expect(t.deps.pool.query("update signoffs set status = 'in_progress' where id = $1", [s.id])).rejects.toThrow(/never changes/);
    const upload2 = await tech.post('/api/evidence').field('entity', 'signoff').field('entityId', s.id).attach('file', makePng(), 'late.png');
    expect(upload2.body.error.fields.entityId).toBe('that sign-off is signed and no longer changes');
  });

  it('when the person tries to countersign their own sign-off, then 403; an assessor covering the site countersigns and what rests on it is issued', async () => {
    const own = await openSignoff(assessor);
    await complete(assessor, own);
    await assessor.post(`/api/signoffs/${own.id}/submit`).send({ password: DEMO_PASSWORD });
    const self = await assessor.post(`/api/signoffs/${own.id}/countersign`).send({ password: DEMO_PASSWORD });
    expect(self.status).toBe(403);
    expect(self.body.error.message).toBe('Nobody countersigns or returns their own sign-off.');
    await acknowledge(tech, proc.id, proc.versionId);
    t.clock.set('2026-03-02T10:00:00Z');
    const manager = await signIn(t, DEMO.manager);
    const scope = await manager.post('/api/scopes').send({ code: 'DIM-DEAD', title: 'Dead work on lamp dimmers', maxVoltageV: 250, maxCurrentA: 5, allowsLiveWork: false, validityMonths: 24, requirements: [{ kind: 'procedure_ack', procedureId: proc.id }] });
    expect(scope.status, JSON.stringify(scope.body)).toBe(201);
    t.clock.set('2026-03-02T11:00:00Z');
    const s = await openSignoff(tech);
    await complete(tech, s);
    await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: DEMO_PASSWORD });
    expect((await tech.post(`/api/signoffs/${s.id}/countersign`).send({ password: DEMO_PASSWORD })).status).toBe(403);
    const pending = (await assessor.get('/api/signoffs').query({ awaitingMe: 'true', pageSize: 50 })).body;
    expect(pending.items.map((r: { id: string }) => r.id)).toContain(s.id);
    expect(pending.items.map((r: { id: string }) => r.id)).not.toContain(own.id);
    const done = await assessor.post(`/api/signoffs/${s.id}/countersign`).send({ password: DEMO_PASSWORD });
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    expect(done.body.signatures.map((x: { meaning: string }) => x.meaning)).toEqual(['completed as recorded', 'countersigned']);
    const issued = await t.ownerQuery("select at, new_values from audit_log where action = 'authorisation.issued'");
    expect(issued.rows.map((r) => [r.at.toISOString(), r.new_values.triggeredBy])).toEqual([['2026-03-02T11:00:00.000Z', assessor.user.id]]);
  });

  it('when an assessor returns a sign-off, then the technician corrects it as a new record linked to the old, and both stay visible', async () => {
    const s = await openSignoff(tech);
    await complete(tech, s);
    await tech.post(`/api/signoffs/${s.id}/submit`).send({ password: DEMO_PASSWORD });
    const returned = await assessor.post(`/api/signoffs/${s.id}/return`).send({ comment: 'The serial number is of the wrong unit.' });
    expect(returned.body).toMatchObject({ status: 'returned', review: { byName: 'Priya Natarajan', comment: 'The serial number is of the wrong unit.', outcome: 'returned' } });
    const fix = await tech.post(`/api/signoffs/${s.id}/corrections`).send({ reason: 'Serial number of the wrong unit written.' });
    expect(fix.status, JSON.stringify(fix.body)).toBe(201);
    expect(fix.body).toMatchObject({ status: 'in_progress', corrects: { id: s.id, reason: 'Serial number of the wrong unit written.' }, progress: { done: 4, total: 4 } });
    await put(tech, fix.body, 'Serial number', { text: 'DIM-2292' });
    expect((await tech.post(`/api/signoffs/${fix.body.id}/submit`).send({ password: DEMO_PASSWORD })).body.status).toBe('submitted');
    const old = (await tech.get(`/api/signoffs/${s.id}`)).body;
    expect(old).toMatchObject({ status: 'returned', correctedBy: { id: fix.body.id } });
    expect(itemByPrompt(old, 'Serial number').entry.text).toBe('DIM-2291');
    const mine = (await tech.get('/api/signoffs').query({ q: proc.version.code, pageSize: 100 })).body.items;
    expect(mine.find((r: { id: string }) => r.id === s.id)).toMatchObject({ correctedById: fix.body.id, status: 'returned' });
  });
});
