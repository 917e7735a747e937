import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { acknowledge, CIRCUIT, itemByPrompt, lookups, publishRecordsProcedure } from '../support/records.js';
import { makePng } from '../fixtures/evidence-files.js';

// The clock starts at 2026-03-02T09:00Z; the demo's LEJ-B2 inspection fell due 30 days before that.
let t: TestApp;
let assessor: Awaited<ReturnType<typeof signIn>>;
let tech: Awaited<ReturnType<typeof signIn>>;
let manager: Awaited<ReturnType<typeof signIn>>;
let proc: Awaited<ReturnType<typeof publishRecordsProcedure>>;
let ids: Awaited<ReturnType<typeof lookups>>;

beforeAll(async () => {
  t = await makeTestApp();
  [assessor, tech, manager] = [await signIn(t, DEMO.assessor), await signIn(t, DEMO.technician), await signIn(t, DEMO.manager)];
  proc = await publishRecordsProcedure(t);
  ids = await lookups(assessor);
});

const body = (over: Record<string, unknown> = {}) => ({
  technicianId: tech.user.id, benchId: ids.benches['LEJ-B1'], procedureId: proc.id, versionId: proc.versionId, instrumentIds: [], circuit: CIRCUIT, ...over,
});
const count = async () => Number((await t.ownerQuery('select count(*) from practicals')).rows[0].count);

async function signedPractical() {
  const p = (await assessor.post('/api/practicals').send(body())).body;
  const nyc = await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'not_yet_competent', comment: 'Stopped at the first hold point.', password: DEMO_PASSWORD });
  expect(nyc.status, JSON.stringify(nyc.body)).toBe(200);
  return p;
}

describe('who may run a practical, and on what', () => {
  it('when the bench is past its inspection date, then the practical is refused with the reason and nothing is stored', async () => {
    const before = await count();
    const res = await assessor.post('/api/practicals').send(body({ benchId: ids.benches['LEJ-B2'] }));
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'bench_not_usable', fields: { nextInspectionOn: 'bench LEJ-B2 inspection was due on 2026-01-31' } });
    expect(await count()).toBe(before);
  });

  it('when an instrument is past its calibration date, then the practical is refused naming it', async () => {
    const late = await manager.post('/api/instruments').send({
      siteId: assessor.user.site.id, kind: 'multimeter', make: 'Ohmwerk', model: 'DM 20', serial: 'OW20-LATE', measurementCategory: 'CAT III', voltageRating: 600, trueRms: true, calibrationDueOn: '2026-02-27',
    });
    expect(late.status, JSON.stringify(late.body)).toBe(201);
    const res = await assessor.post('/api/practicals').send(body({ instrumentIds: [late.body.id] }));
    expect(res.status).toBe(409);
    expect(res.body.error.fields.calibrationDueOn).toBe('instrument SN OW20-LATE calibration expired on 2026-02-27');
    const p = (await assessor.post('/api/practicals').send(body())).body;
    const reading = await assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, 'Output RMS voltage').id}`).send({ value: 190, unit: 'V', instrumentId: late.body.id });
    expect(reading.status).toBe(409);
    expect(reading.body.error.code).toBe('instrument_not_usable');
  });

  it('when an assessor names themselves as the technician, then 403; a technician cannot open one at all', async () => {
    const self = await assessor.post('/api/practicals').send(body({ technicianId: assessor.user.id }));
    expect(self.status).toBe(403);
    expect(self.body.error.message).toMatch(/never assesses themselves/);
    expect((await tech.post('/api/practicals').send(body({ technicianId: assessor.user.id }))).status).toBe(403);
    const candidates = (await assessor.get('/api/practicals/technicians')).body.items.map((c: { id: string }) => c.id);
    expect(candidates).toContain(tech.user.id);
    expect(candidates).not.toContain(assessor.user.id);
  });

  it('when the practical names a scope the assessor does not hold, then 403 says so', async () => {
    const scope = await manager.post('/api/scopes').send({ code: 'LIVE-PC', title: 'Live testing of phase-control circuits', maxVoltageV: 250, maxCurrentA: 10, allowsLiveWork: true, validityMonths: 12, requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
    expect(scope.status, JSON.stringify(scope.body)).toBe(201);
    const res = await assessor.post('/api/practicals').send(body({ scopeId: scope.body.id }));
    expect(res.status).toBe(403);
    expect(res.body.error.message).toContain('You do not hold LIVE-PC in force today');
    // The demo's assessor holds LIVE-ISO-RCD (recorded from a paper authorisation): naming it opens the practical.
    const held = (await manager.get('/api/scopes')).body.find((sc: { code: string }) => sc.code === 'LIVE-ISO-RCD');
    const ok = await assessor.post('/api/practicals').send(body({ scopeId: held.id }));
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(ok.body.scope).toMatchObject({ code: 'LIVE-ISO-RCD' });
  });

  it('when a practical is signed, then edits get 409 (the database refuses them too) and a correction links to it', async () => {
    const p = await signedPractical();
    const item = itemByPrompt(p, 'Output RMS voltage').id;
    expect((await assessor.put(`/api/practicals/${p.id}/items/${item}`).send({ value: 190, unit: 'V', instrumentId: ids.instruments['OW61-20417'] })).status).toBe(409);
    expect((await assessor.post(`/api/practicals/${p.id}/hold-points/${p.holdPoints[0].stepKey}`).send({})).status).toBe(409);
    await expect(t.deps.pool.query("update practicals set outcome = 'competent' where id = $1", [p.id])).rejects.toThrow(/never changes/);
    await expect(t.deps.pool.query('delete from practicals where id = $1', [p.id])).rejects.toThrow(/permission denied/);
    expect((await tech.post(`/api/practicals/${p.id}/corrections`).send({ reason: 'I think it was fine.' })).status).toBe(403);
    const fix = await assessor.post(`/api/practicals/${p.id}/corrections`).send({ reason: 'Wrong outcome ticked: the practical was stopped, record the reason.' });
    expect(fix.status, JSON.stringify(fix.body)).toBe(201);
    expect(fix.body).toMatchObject({ status: 'in_progress', corrects: { id: p.id, reason: 'Wrong outcome ticked: the practical was stopped, record the reason.' }, heldAt: p.heldAt });
    const old = (await manager.get(`/api/practicals/${p.id}`)).body;
    expect(old).toMatchObject({ status: 'assessed', outcome: 'not_yet_competent', correctedBy: { id: fix.body.id } });
    expect((await assessor.post(`/api/practicals/${p.id}/corrections`).send({ reason: 'A second correction.' })).status).toBe(409);
  });

  it('when evidence is uploaded to an open practical, then it belongs to the technician; once signed, uploads are refused', async () => {
    const p = (await assessor.post('/api/practicals').send(body())).body;
    const up = await assessor.post('/api/evidence').field('entity', 'practical').field('entityId', p.id).field('ownerId', tech.user.id).attach('file', makePng(), 'scope-capture.png');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    expect((await tech.get(`/api/evidence/${up.body.id}`)).status).toBe(200);
    await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'not_yet_competent', comment: 'Stopped early.', password: DEMO_PASSWORD });
    const late = await assessor.post('/api/evidence').field('entity', 'practical').field('entityId', p.id).field('ownerId', tech.user.id).attach('file', makePng(), 'late.png');
    expect(late.status).toBe(422);
    expect(late.body.error.fields.entityId).toBe('that practical is signed and no longer changes');
  });

  it('when a competent practical gets its last signature, then an authorisation resting on it is issued in that transaction', async () => {
    await acknowledge(tech, proc.id, proc.versionId);
    t.clock.set('2026-03-02T10:00:00Z');
    const scope = await manager.post('/api/scopes').send({ code: 'DIM-LIVE', title: 'Live testing of lamp dimmers', maxVoltageV: 250, maxCurrentA: 5, allowsLiveWork: true, validityMonths: 12, requirements: [{ kind: 'procedure_ack', procedureId: proc.id }] });
    expect(scope.status, JSON.stringify(scope.body)).toBe(201);
    t.clock.set('2026-03-02T11:00:00Z');
    const p = (await assessor.post('/api/practicals').send(body())).body;
    for (const h of p.holdPoints) await assessor.post(`/api/practicals/${p.id}/hold-points/${h.stepKey}`).send({});
    const entries: [string, Record<string, unknown>][] = [
      ['The technician proved dead', { checked: true }],
      ['Firing angle', { value: 72, unit: '°', instrumentId: ids.instruments['BL70-5531'] }],
      ['Output RMS voltage', { value: 191, unit: 'V', instrumentId: ids.instruments['OW61-20417'] }],
      ['Bench RCD', { value: 24, unit: 'ms', instrumentId: ids.instruments['TF3-11902'] }],
    ];
    for (const [prompt, entry] of entries) expect((await assessor.put(`/api/practicals/${p.id}/items/${itemByPrompt(p, prompt).id}`).send(entry)).status).toBe(200);
    expect((await assessor.post(`/api/practicals/${p.id}/assess`).send({ outcome: 'competent', comment: 'Safe and methodical.', password: DEMO_PASSWORD })).status).toBe(200);
    t.clock.set('2026-03-02T11:30:00Z');
    expect((await assessor.post(`/api/practicals/${p.id}/acknowledge`).send({ technician: DEMO.technician, password: DEMO_PASSWORD })).status).toBe(200);
    const issued = await t.ownerQuery("select at, new_values from audit_log where action = 'authorisation.issued' order by id");
    expect(issued.rows).toHaveLength(1);
    expect(issued.rows[0].at.toISOString()).toBe('2026-03-02T11:30:00.000Z');
    expect(issued.rows[0].new_values.triggeredBy).toBe(tech.user.id);
    expect((await tech.get('/api/authorisations/mine')).body.items.map((i: { scope: { id: string } }) => i.scope.id)).toEqual([scope.body.id]);
  });
});
