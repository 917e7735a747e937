import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';

// The clock starts at 2026-03-02T09:00Z; the demo's LEJ-B2 inspection fell due 30 days before that.
let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let tech: Awaited<ReturnType<typeof signIn>>;
const site: Record<string, string> = {};
const bench: Record<string, string> = {};
const instrument: Record<string, string> = {};

const goodBench = (siteId: string, code: string, nextInspectionOn = '2026-09-30') => ({
  siteId, code, name: `Bench ${code}`, supplyVoltage: 230, supplyFrequency: 50, isolatingTransformer: true, isolatingTransformerVa: 800,
  rcdType: 'A', rcdRatedResidualMa: 30, emergencyStop: true, nextInspectionOn,
});

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  tech = await signIn(t, DEMO.technician);
  for (const s of (await manager.get('/api/sites')).body) site[s.code] = s.id;
  for (const b of (await manager.get('/api/benches').query({ pageSize: 100 })).body.items) bench[b.code] = b.id;
  for (const i of (await manager.get('/api/instruments').query({ pageSize: 100 })).body.items) instrument[i.serial] = i.id;
});

const auditCount = async (action: string, entityId: string) =>
  Number((await t.ownerQuery('select count(*) from audit_log where action = $1 and entity_id = $2', [action, entityId])).rows[0].count);

describe('benches', () => {
  it('when a manager adds a bench at their site, then it comes back with its flags and the change is in the audit trail', async () => {
    const res = await manager.post('/api/benches').send({ ...goodBench(site['LEJ-W1'], 'LEJ-B9'), isolatingTransformer: false, isolatingTransformerVa: null });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ code: 'LEJ-B9', siteCode: 'LEJ-W1', timeZone: 'Europe/Berlin', latestCheck: null, active: true });
    expect(res.body.flags.map((f: { code: string }) => f.code)).toEqual(['no_isolating_transformer']);
    expect(await auditCount('bench.created', res.body.id)).toBe(1);
  });

  it('when the set-up pairs do not match, then the field is named and nothing is stored', async () => {
    const missing = await manager.post('/api/benches').send({ ...goodBench(site['LEJ-W1'], 'LEJ-B8'), isolatingTransformerVa: null });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('isolatingTransformerVa');
    const patch = await manager.patch(`/api/benches/${bench['LEJ-B1']}`).send({ rcdType: null });
    expect(patch.status).toBe(422);
    expect(patch.body.error.fields.rcdRatedResidualMa).toMatch(/leave empty when no RCD/);
    expect((await manager.get(`/api/benches/${bench['LEJ-B1']}`)).body.rcdType).toBe('A');
    const badDate = await manager.post('/api/benches').send(goodBench(site['LEJ-W1'], 'LEJ-B8', '2026-02-30'));
    expect(badDate.body.error.fields.nextInspectionOn).toBe('must be a real date between 1900 and 2199');
    expect((await manager.get('/api/benches').query({ q: 'LEJ-B8' })).body.total).toBe(0);
  });

  it('when the code is taken at that site, then 409 names the code', async () => {
    const res = await manager.post('/api/benches').send(goodBench(site['LEJ-W1'], 'LEJ-B1'));
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toHaveProperty('code');
  });

  it('when a manager works at a site they do not cover, then 403 and nothing changes', async () => {
    const manager2 = await signIn(t, DEMO.manager2);
    expect((await manager2.post('/api/benches').send(goodBench(site['LEJ-W1'], 'LEJ-B7'))).status).toBe(403);
    expect((await manager2.patch(`/api/benches/${bench['LEJ-B1']}`).send({ name: 'taken over' })).status).toBe(403);
    expect((await manager2.get(`/api/benches/${bench['LEJ-B1']}`)).status).toBe(403);
  });

  it('when a technician lists benches, then only those of their own site come back; an auditor sees every site', async () => {
    const mine = (await tech.get('/api/benches')).body.items.map((b: { code: string }) => b.code);
    expect(mine).toContain('LEJ-B1');
    expect(mine.some((c: string) => c.startsWith('CLE-'))).toBe(false);
    const auditor = await signIn(t, DEMO.auditor);
    const all = (await auditor.get('/api/benches').query({ pageSize: 100 })).body.items.map((b: { code: string }) => b.code);
    expect(all).toEqual(expect.arrayContaining(['LEJ-B1', 'LEJ-B2', 'CLE-B1', 'CLE-B2']));
  });

  it('when filtered for overdue inspections, then the server returns just those, paged', async () => {
    const res = await manager.get('/api/benches').query({ inspection: 'overdue', pageSize: 1 });
    expect(res.body).toMatchObject({ total: 1, page: 1, pageSize: 1 });
    expect(res.body.items[0].code).toBe('LEJ-B2');
    expect(res.body.items[0].flags[0]).toMatchObject({ code: 'inspection_overdue', severity: 'refuse' });
  });
});

describe('bench usability', () => {
  it('when a bench is past its inspection date, then it is refused with the reason', async () => {
    const res = await tech.get(`/api/benches/${bench['LEJ-B2']}/usability`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('bench LEJ-B2 inspection was due on 2026-01-31');
    expect(res.body.error.fields).toEqual({ nextInspectionOn: 'bench LEJ-B2 inspection was due on 2026-01-31' });
  });

  it('when the inspection falls due today, then the bench is usable until the end of that day where it stands', async () => {
    const created = (await manager.post('/api/benches').send(goodBench(site['LEJ-W1'], 'LEJ-B6', '2026-03-10'))).body;
    t.clock.set('2026-03-10T22:59:59Z'); // 23:59:59 in Leipzig (CET, UTC+1)
    const lastMinute = await tech.get(`/api/benches/${created.id}/usability`);
    expect(lastMinute.status).toBe(200);
    expect(lastMinute.body.warnings.map((w: { code: string }) => w.code)).toContain('inspection_due');
    t.clock.set('2026-03-10T23:00:00Z'); // midnight in Leipzig
    expect((await tech.get(`/api/benches/${created.id}/usability`)).status).toBe(409);
    t.clock.set('2026-03-02T09:00:00Z');
  });

  it('when the latest pre-use check failed, then the bench is refused until a later check passes', async () => {
    const failed = await tech.post(`/api/benches/${bench['LEJ-B1']}/pre-use-checks`).send({ passed: false, notes: 'RCD test button did not trip', password: DEMO_PASSWORD });
    expect(failed.status).toBe(201);
    expect(failed.body.signatures[0]).toMatchObject({ printedName: 'Tomasz Wójcik', meaning: 'pre-use check carried out as recorded' });
    const refused = await tech.get(`/api/benches/${bench['LEJ-B1']}/usability`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe('bench LEJ-B1 failed its latest pre-use check on 2026-03-02: RCD test button did not trip');
    expect(refused.body.error.fields).toHaveProperty('preUseCheck');
    t.clock.advance(60_000);
    expect((await tech.post(`/api/benches/${bench['LEJ-B1']}/pre-use-checks`).send({ passed: true, password: DEMO_PASSWORD })).status).toBe(201);
    const usable = await tech.get(`/api/benches/${bench['LEJ-B1']}/usability`);
    expect(usable.status).toBe(200);
    expect(usable.body).toMatchObject({ usable: true, bench: { code: 'LEJ-B1', latestCheck: { passed: true } } });
    const history = await tech.get(`/api/benches/${bench['LEJ-B1']}/pre-use-checks`);
    expect(history.body.items.map((c: { passed: boolean }) => c.passed)).toEqual([true, false]);
  });

  it('when a pre-use check is signed with a wrong password or fails without notes, then it is refused and nothing is stored', async () => {
    const before = (await tech.get(`/api/benches/${bench['LEJ-B1']}/pre-use-checks`)).body.total;
    const wrong = await tech.post(`/api/benches/${bench['LEJ-B1']}/pre-use-checks`).send({ passed: true, password: 'not my password at all' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields).toHaveProperty('password');
    const noNotes = await tech.post(`/api/benches/${bench['LEJ-B1']}/pre-use-checks`).send({ passed: false, password: DEMO_PASSWORD });
    expect(noNotes.status).toBe(400);
    expect(noNotes.body.error.fields.notes).toBe('say what failed');
    expect((await tech.get(`/api/benches/${bench['LEJ-B1']}/pre-use-checks`)).body.total).toBe(before);
  });

  it('when a technician checks a bench at another site, then 403', async () => {
    const res = await tech.post(`/api/benches/${bench['CLE-B2']}/pre-use-checks`).send({ passed: true, password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
  });

  it('when a bench has a Type AC RCD, then it is usable but flagged as unsuitable for phase-cut loads', async () => {
    const res = await manager.get(`/api/benches/${bench['CLE-B1']}/usability`);
    expect(res.status).toBe(200);
    expect(res.body.warnings).toContainEqual(expect.objectContaining({ code: 'rcd_type_ac', message: expect.stringMatching(/^Type AC RCD — not suitable for phase-cut loads/) }));
  });

  it('when the practical service asks about an earlier moment, then the answer is for that moment', async () => {
    const earlier = await t.services.usability.checkBenchUsable(bench['LEJ-B2'], new Date('2026-01-31T22:59:00Z'));
    expect(earlier.usable).toBe(true);
    await expect(t.services.usability.checkBenchUsable(bench['LEJ-B2'], new Date('2026-01-31T23:00:00Z'))).rejects.toMatchObject({ status: 409 });
  });
});

describe('instrument usability', () => {
  it('when an instrument is past its calibration date, then it is refused with the reason', async () => {
    const res = await manager.get(`/api/instruments/${instrument['12345']}/usability`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('instrument SN 12345 calibration expired on 2026-02-14');
    expect(res.body.error.fields).toHaveProperty('calibrationDueOn');
  });

  it('when the circuit voltage is above the rating, then 422 names the rating; within it, the instrument is usable', async () => {
    const created = await manager.post('/api/instruments').send({
      siteId: site['LEJ-W1'], kind: 'multimeter', make: 'Testwerk', model: 'T2', serial: 'T2-300', measurementCategory: 'CAT II', voltageRating: 300, trueRms: false, calibrationDueOn: '2026-12-31',
    });
    expect(created.status).toBe(201);
    expect(created.body.flags.map((f: { code: string }) => f.code)).toEqual(['not_true_rms']);
    const high = await tech.get(`/api/instruments/${created.body.id}/usability`).query({ voltage: 400 });
    expect(high.status).toBe(422);
    expect(high.body.error.message).toBe('instrument SN T2-300 rated CAT II 300 V is not rated for a 400 V circuit');
    expect(high.body.error.fields).toHaveProperty('voltage');
    expect((await tech.get(`/api/instruments/${created.body.id}/usability`).query({ voltage: 230 })).status).toBe(200);
    const bad = await tech.get(`/api/instruments/${created.body.id}/usability`).query({ voltage: 'mains' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('query.voltage');
  });

  it('when the same make, model and serial is added twice, then 409 names the serial', async () => {
    const body = { siteId: site['LEJ-W1'], kind: 'rcd_tester', make: 'Trennfeld', model: 'RT 3', serial: 'TF3-11902', measurementCategory: 'CAT III', voltageRating: 300, trueRms: false, calibrationDueOn: '2026-12-31' };
    const res = await manager.post('/api/instruments').send(body);
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toHaveProperty('serial');
  });

  it('when a manager edits an instrument, then the change and its old value are audited', async () => {
    const res = await manager.patch(`/api/instruments/${instrument['OW25-00388']}`).send({ calibrationDueOn: '2027-01-15' });
    expect(res.status).toBe(200);
    expect(res.body.calibrationDueOn).toBe('2027-01-15');
    const { rows } = await t.ownerQuery("select old_values, new_values from audit_log where action = 'instrument.updated' and entity_id = $1", [instrument['OW25-00388']]);
    expect(rows).toHaveLength(1);
    expect(rows[0].new_values).toEqual({ calibrationDueOn: '2027-01-15' });
    expect(rows[0].old_values.calibrationDueOn).not.toBe('2027-01-15');
  });

  it('when filtered for expired calibration, then an auditor sees those of every site', async () => {
    const auditor = await signIn(t, DEMO.auditor);
    const res = await auditor.get('/api/instruments').query({ calibration: 'expired' });
    expect(res.body.items.map((i: { serial: string }) => i.serial)).toEqual(['12345']);
    expect((await tech.get('/api/instruments').query({ calibration: 'expired' })).body.total).toBe(0);
  });
});
