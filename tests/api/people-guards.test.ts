import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { personSnapshot } from '../support/person-snapshot.js';
import { acceptedSpellings, refusedSpellings } from '../support/id-spellings.js';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signIn>>;
let manager: Awaited<ReturnType<typeof signIn>>;
let manager2: Awaited<ReturnType<typeof signIn>>;
let sites: { id: string; code: string }[];
const idOf = async (email: string) => (await t.ownerQuery('select id from users where email = $1', [email])).rows[0].id as string;
const site = (code: string) => sites.find((s) => s.code === code)!.id;

beforeAll(async () => {
  t = await makeTestApp();
  admin = await signIn(t, DEMO.admin);
  manager = await signIn(t, DEMO.manager);
  manager2 = await signIn(t, DEMO.manager2);
  sites = (await admin.get('/api/sites')).body;
});

/** Sends the change and expects `status` with the field named, and the person exactly as before. */
async function refused(agent: typeof admin, id: string, body: object, status: number, field: string) {
  const before = await personSnapshot(t, id);
  const res = await agent.patch(`/api/people/${id}`).send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.body.error.message).toMatch(new RegExp(`^${field}: `));
  expect(res.body.error.fields).toHaveProperty(field);
  expect(await personSnapshot(t, id)).toEqual(before);
  return res;
}

describe('nobody widens their own reach', () => {
  it('when a manager gives themselves another site to cover, then 403 naming coveredSiteIds and nothing changes', async () => {
    const other = (await admin.post('/api/sites').send({ code: 'OTH-1', name: 'Other site', timeZone: 'UTC', personTerm: 'skilled person' })).body.id;
    const res = await refused(manager2, manager2.user.id, { coveredSiteIds: [other] }, 403, 'coveredSiteIds');
    expect(res.body.error.fields.coveredSiteIds).toBe('you may not give yourself sites');
  });

  it('when an admin changes their own roles, end date or active state with their id in any accepted spelling, then 403', async () => {
    for (const spelling of acceptedSpellings(admin.user.id)) {
      await refused(admin, spelling, { roles: ['admin', 'auditor'] }, 403, 'roles');
      await refused(admin, spelling, { accessEndsOn: '2026-12-31' }, 403, 'accessEndsOn');
      await refused(admin, spelling, { active: false, deactivatedReason: 'testing myself' }, 403, 'active');
      await refused(admin, spelling, { siteId: site('CLE-L2') }, 403, 'siteId');
    }
    const renamed = await admin.patch(`/api/people/${admin.user.id.toUpperCase()}`).send({ name: 'Ines Albrecht-Roth' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.id).toBe(admin.user.id);
  });

  it('when an id is braced, unhyphenated, urn-prefixed or padded, then 400 naming params.id and nothing changes', async () => {
    for (const spelling of refusedSpellings(admin.user.id)) {
      const before = await personSnapshot(t, admin.user.id);
      const res = await admin.patch(`/api/people/${encodeURIComponent(spelling)}`).send({ name: 'Someone Else' });
      expect(res.status, spelling).toBe(400);
      expect(res.body.error.fields).toHaveProperty('params.id');
      expect(await personSnapshot(t, admin.user.id)).toEqual(before);
    }
  });
});

describe('managers change technicians and assessors of their sites, with their sites and roles', () => {
  it('when a manager switches off the only admin or ends an auditor\'s access, then 403 and nothing changes', async () => {
    await refused(manager, await idOf(DEMO.admin), { active: false, deactivatedReason: 'taking over' }, 403, 'active');
    await refused(manager, await idOf(DEMO.auditor), { accessEndsOn: '2026-04-01' }, 403, 'accessEndsOn');
    await refused(manager, await idOf(DEMO.manager2), { name: 'Renamed Manager' }, 403, 'name');
  });

  it('when a manager gives a technician a site or role they could not hold or give, then 403; within their reach, then 200 stored lower-case', async () => {
    const tech3 = await idOf(DEMO.technician3);
    await refused(manager2, tech3, { coveredSiteIds: [site('LEJ-W1')] }, 403, 'coveredSiteIds');
    await refused(manager2, tech3, { siteId: site('LEJ-W1') }, 403, 'siteId');
    await refused(manager2, tech3, { roles: ['technician', 'manager'] }, 403, 'roles');
    const ok = await manager.patch(`/api/people/${tech3.toUpperCase()}`).send({ siteId: site('LEJ-W1').toUpperCase(), coveredSiteIds: [site('CLE-L2').toUpperCase()] });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.body).toMatchObject({ siteId: site('LEJ-W1'), coveredSiteIds: [site('CLE-L2')] });
  });

  it('when a manager invites a person covering a site they do not cover, then 403 and nobody is added', async () => {
    const users = (await t.ownerQuery('select count(*) from users')).rows[0].count;
    const res = await manager2.post('/api/people').send({ email: 'wide@example.test', name: 'Wide Reach', siteId: site('CLE-L2'), roles: ['assessor'], coveredSiteIds: [site('LEJ-W1')] });
    expect(res.status).toBe(403);
    expect(res.body.error.fields).toHaveProperty('coveredSiteIds');
    expect((await t.ownerQuery('select count(*) from users')).rows[0].count).toBe(users);
  });
});

describe('the last active admin', () => {
  it('when the only admin without an end date would be switched off, given an end date or lose the role, then 409; with a second one, then 200', async () => {
    const adminId = await idOf(DEMO.admin);
    const second = (await admin.post('/api/people').send({ email: 'admin2@example.test', name: 'Second Admin', siteId: site('LEJ-W1'), roles: ['admin'], accessEndsOn: '2026-12-31' })).body.id;
    await t.ownerQuery(`update users set password_hash = (select password_hash from users where id = $1) where id = $2`, [adminId, second]);
    const other = await signIn(t, 'admin2@example.test');
    await refused(other, adminId, { active: false, deactivatedReason: 'leaving' }, 409, 'active');
    await refused(other, adminId, { accessEndsOn: '2026-06-30' }, 409, 'accessEndsOn');
    await refused(other, adminId, { roles: ['auditor'] }, 409, 'roles');
    expect((await admin.patch(`/api/people/${second}`).send({ accessEndsOn: null })).status).toBe(200);
    expect((await other.patch(`/api/people/${adminId}`).send({ roles: ['admin', 'auditor'] })).status).toBe(200);
    expect((await other.patch(`/api/people/${adminId}`).send({ accessEndsOn: '2026-06-30' })).status).toBe(200);
  });
});
