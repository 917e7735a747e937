import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { CIRCUIT, lookups, publishRecordsProcedure } from '../support/records.js';

// Demo: CLE-B1 (Cleveland) has a Type AC RCD, CLE-B2 a Type A; Tomasz (technician) belongs to Leipzig,
// Marcus (technician3) to Cleveland; Priya (assessor) covers both sites.
let t: TestApp;
let assessor: Awaited<ReturnType<typeof signIn>>;
let manager: Awaited<ReturnType<typeof signIn>>;
let tech: Awaited<ReturnType<typeof signIn>>;
let tech3: Awaited<ReturnType<typeof signIn>>;
let proc: Awaited<ReturnType<typeof publishRecordsProcedure>>;
let ids: Awaited<ReturnType<typeof lookups>>;

beforeAll(async () => {
  t = await makeTestApp();
  [assessor, manager, tech, tech3] = [await signIn(t, DEMO.assessor), await signIn(t, DEMO.manager), await signIn(t, DEMO.technician), await signIn(t, DEMO.technician3)];
  proc = await publishRecordsProcedure(t);
  ids = await lookups(assessor);
});

const body = (over: Record<string, unknown>) => ({ procedureId: proc.id, versionId: proc.versionId, instrumentIds: [], circuit: CIRCUIT, ...over });
const count = async (table: string) => Number((await t.ownerQuery(`select count(*) from ${table}`)).rows[0].count);

describe('a Type AC bench', () => {
  it('when no manager has accepted it, then a practical on it is refused naming benchId and the reason, and nothing is stored', async () => {
    const before = await count('practicals');
    const res = await assessor.post('/api/practicals').send(body({ technicianId: tech3.user.id, benchId: ids.benches['CLE-B1'] }));
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('bench_type_ac');
    expect(res.body.error.fields.benchId).toMatch(/^bench CLE-B1 has a Type AC RCD: a phase-cut load leaks pulsating DC/);
    expect(await count('practicals')).toBe(before);
  });

  it('when someone other than a manager, a short reason or a Type A bench is given, then the decision is refused and nothing is written', async () => {
    const reason = 'A Type A 30 mA device is fitted ahead of this bench in the sub-board.';
    expect((await assessor.post(`/api/benches/${ids.benches['CLE-B1']}/type-ac-decisions`).send({ reason })).status).toBe(403);
    const short = await manager.post(`/api/benches/${ids.benches['CLE-B1']}/type-ac-decisions`).send({ reason: 'ok' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.reason).toMatch(/at least 10 characters/);
    const typeA = await manager.post(`/api/benches/${ids.benches['CLE-B2']}/type-ac-decisions`).send({ reason });
    expect(typeA.status).toBe(422);
    expect(typeA.body.error.fields.rcdType).toBe('not Type AC: nothing to accept');
    expect(await count('bench_type_ac_decisions')).toBe(0);
  });

  it('when a manager records why it is accepted, then a practical opens on it and shows who decided, when and why; the decision is in the trail', async () => {
    const reason = 'A Type A 30 mA device is fitted ahead of this bench in the sub-board.';
    const decided = await manager.post(`/api/benches/${ids.benches['CLE-B1']}/type-ac-decisions`).send({ reason });
    expect(decided.status, JSON.stringify(decided.body)).toBe(201);
    expect(decided.body).toMatchObject({ decidedByName: 'Jörg Łukasik', reason, decidedAt: '2026-03-02T09:00:00.000Z' });
    const usability = await assessor.get(`/api/benches/${ids.benches['CLE-B1']}/usability`);
    expect(usability.body.typeAcDecision).toMatchObject({ id: decided.body.id, reason });
    const p = await assessor.post('/api/practicals').send(body({ technicianId: tech3.user.id, benchId: ids.benches['CLE-B1'] }));
    expect(p.status, JSON.stringify(p.body)).toBe(201);
    expect(p.body.typeAcDecision).toEqual({ byName: 'Jörg Łukasik', at: '2026-03-02T09:00:00.000Z', reason });
    expect(p.body.crossSiteReason).toBeNull();
    const trail = await t.ownerQuery(`select new_values from audit_log where action = 'bench.type_ac_accepted'`);
    expect(trail.rows).toEqual([{ new_values: { decisionId: decided.body.id, reason } }]);
  });
});

describe('a bench at another site than the technician', () => {
  it('when no reason is given, then the practical is refused naming crossSiteReason and nothing is stored', async () => {
    const before = await count('practicals');
    const res = await assessor.post('/api/practicals').send(body({ technicianId: tech.user.id, benchId: ids.benches['CLE-B2'] }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.crossSiteReason).toBe("bench CLE-B2 is at another site than the technician's: say why they work there");
    expect(await count('practicals')).toBe(before);
  });

  it('when a reason is given, then the practical opens and carries it; at their own site no reason is kept', async () => {
    const crossSiteReason = 'Seconded to Cleveland for the heater regulator commissioning week.';
    const p = await assessor.post('/api/practicals').send(body({ technicianId: tech.user.id, benchId: ids.benches['CLE-B2'], crossSiteReason }));
    expect(p.status, JSON.stringify(p.body)).toBe(201);
    expect((await assessor.get(`/api/practicals/${p.body.id}`)).body.crossSiteReason).toBe(crossSiteReason);
    const home = await assessor.post('/api/practicals').send(body({ technicianId: tech.user.id, benchId: ids.benches['LEJ-B1'], crossSiteReason }));
    expect(home.status).toBe(201);
    expect(home.body.crossSiteReason).toBeNull();
  });

  it('when the assessor does not cover the bench’s site, then 403 and nothing is stored', async () => {
    const off = await manager.patch(`/api/people/${assessor.user.id}`).send({ coveredSiteIds: [] });
    expect(off.status, JSON.stringify(off.body)).toBe(200);
    const before = await count('practicals');
    const res = await assessor.post('/api/practicals').send(body({ technicianId: tech.user.id, benchId: ids.benches['CLE-B2'], crossSiteReason: 'Seconded for a week.' }));
    expect(res.status).toBe(403);
    expect(res.body.error.message).toBe('You do not cover the site of bench CLE-B2.');
    expect(await count('practicals')).toBe(before);
  });
});
