import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { makeScope } from '../support/authorisations.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
});

const body = (extra: object = {}) => ({
  code: 'LIVE-TRIAC-250', title: 'Live fault-finding on triac dimmers up to 250 V / 10 A', maxVoltageV: 250, maxCurrentA: 10, allowsLiveWork: true,
  validityMonths: 12, reminderOffsetsDays: [60, 30, 7], certificateGraceDays: 14, requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }], ...extra,
});
const scopeCount = async () => (await t.ownerQuery('select count(*)::int as n from scopes')).rows[0].n as number;

describe('scopes', () => {
  it('when a manager defines a scope, then everyone signed in can read it with its limits and requirements', async () => {
    const res = await manager.post('/api/scopes').send(body());
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ code: 'LIVE-TRIAC-250', maxVoltageV: 250, maxCurrentA: 10, allowsLiveWork: true, reminderOffsetsDays: [60, 30, 7], certificateGraceDays: 14 });
    expect(res.body.requirements[0]).toMatchObject({ kind: 'certificate', certificateKind: 'first_aid_cpr', label: 'Current First aid and CPR certificate' });
    const tech = await signIn(t, DEMO.technician);
    expect((await tech.get(`/api/scopes/${res.body.id}`)).body.title).toBe('Live fault-finding on triac dimmers up to 250 V / 10 A');
    expect((await tech.post('/api/scopes').send(body({ code: 'TECH-TRY' }))).status).toBe(403);
    expect((await manager.post('/api/scopes').send(body())).status, 'the code is taken').toBe(409);
  });

  it('when a requirement kind the portal does not record yet, a loop, a repeat or an unknown reference is given, then 422 names it and nothing is stored', async () => {
    const a = await makeScope(manager);
    const b = await makeScope(manager, { requirements: [{ kind: 'prerequisite', scopeId: a.id }, { kind: 'certificate', certificateKind: 'cpr_aed' }] });
    const before = await scopeCount();
    const cases: [object, string][] = [
      [{ requirements: [{ kind: 'prerequisite', scopeId: b.id }, { kind: 'certificate', certificateKind: 'first_aid' }] }, 'requirements'],
      [{ requirements: [{ kind: 'certificate', certificateKind: 'first_aid' }, { kind: 'certificate', certificateKind: 'first_aid' }] }, 'requirements.1'],
      [{ requirements: [{ kind: 'prerequisite', scopeId: a.id }] }, 'requirements'],
      [{ requirements: [{ kind: 'procedure_ack', procedureId: '00000000-0000-4000-8000-000000000001' }] }, 'requirements.0.procedureId'],
      [{ requirements: [{ kind: 'prerequisite', scopeId: a.id }, { kind: 'certificate', certificateKind: 'first_aid' }] }, 'requirements.0.scopeId'],
    ];
    for (const [i, [extra, field]] of cases.entries()) {
      // The first case updates a (making a rest on b, which rests on a); the fifth updates a to rest on itself.
      const res = i === 0 || i === 4
        ? await manager.put(`/api/scopes/${a.id}`).send(body({ code: a.code, ...extra, ...(i === 4 ? { requirements: [{ kind: 'prerequisite', scopeId: a.id }, { kind: 'certificate', certificateKind: 'first_aid' }] } : {}) }))
        : await manager.post('/api/scopes').send(body({ code: `BAD-${i}`, ...extra }));
      expect(res.status, JSON.stringify(res.body)).toBe(422);
      expect(Object.keys(res.body.error.fields)).toEqual([field]);
    }
    expect(await scopeCount()).toBe(before);
    expect((await manager.get(`/api/scopes/${a.id}`)).body.requirements.map((r: { kind: string }) => r.kind), 'the failed updates changed nothing').toEqual(['certificate']);
  });

  it('when limits are out of range, then 400 names the field', async () => {
    const res = await manager.post('/api/scopes').send(body({ code: 'HIGH-V', maxVoltageV: 5000 }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.maxVoltageV).toBe('at most 1000 V');
  });
});
