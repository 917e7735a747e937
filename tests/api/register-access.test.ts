import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { linkToken } from '../support/mail.js';
import { makeScope, mineFor, newPerson, submitCertificate, verifyCertificate, type Person } from '../support/authorisations.js';
import { listSites } from '../../server/sites/sites.repository.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let tech: Person;
let other: Person;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager);
  t.clock.set('2026-03-02T09:00:00Z');
  const scope = await makeScope(manager, { validityMonths: 12 });
  tech = await newPerson(t, { name: 'Oskar Lindqvist' });
  other = await newPerson(t, { name: 'Wen Zhao' });
  await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
  t.clock.set('2026-03-04T09:00:00Z');
  const a = (await mineFor(tech, scope.id))!;
  expect((await manager.post(`/api/authorisations/${a.id}/suspend`).send({ reason: 'Probe leads worn through', password: DEMO_PASSWORD })).status).toBe(200);
});

describe('the person record', () => {
  it('when a person opens their own record, then it holds their roles, site, certificates and authorisations with their history', async () => {
    const res = await tech.get(`/api/people/${tech.id}/record`);
    expect(res.status).toBe(200);
    expect(res.body.person).toMatchObject({ id: tech.id, name: 'Oskar Lindqvist', roles: ['technician'], site: { code: 'LEJ-W1' } });
    expect(res.body.certificates).toEqual([expect.objectContaining({ kind: 'first_aid_cpr', status: 'verified' })]);
    const [auth] = res.body.authorisations;
    expect(auth.state).toBe('suspended');
    expect(auth.periods[0].events.map((e: { kind: string; reason: string | null }) => [e.kind, e.reason])).toEqual([['issued', null], ['suspended', 'Probe leads worn through']]);
    expect(res.body).toHaveProperty('acknowledgements');
    expect(res.body).toHaveProperty('signoffs');
    expect(res.body).toHaveProperty('practicals');
  });

  it('when a technician or an assessor asks for someone else’s record, or a manager of another site, then it is refused', async () => {
    expect((await other.get(`/api/people/${tech.id}/record`)).status).toBe(403);
    expect((await (await signIn(t, DEMO.assessor)).get(`/api/people/${tech.id}/record`)).status).toBe(403);
    expect((await (await signIn(t, DEMO.manager2)).get(`/api/people/${tech.id}/record`)).status).toBe(403);
    expect((await other.get('/api/register')).status).toBe(403);
  });

  it('when the manager of the site, an auditor or an admin asks, then they get it; an unknown person is 404', async () => {
    for (const who of [DEMO.manager, DEMO.auditor, DEMO.admin]) {
      const res = await (await signIn(t, who)).get(`/api/people/${tech.id}/record`);
      expect(res.status, who).toBe(200);
      expect(res.body.authorisations).toHaveLength(1);
    }
    expect((await manager.get('/api/people/00000000-0000-4000-8000-000000000000/record')).status).toBe(404);
  });
});

describe('an external auditor with an end date', () => {
  it('when the admin gives an account ending on a day, then it works through that day at its site and stops after it, session included', async () => {
    const admin = await signIn(t, DEMO.admin);
    const leipzig = (await listSites(t.deps.db)).find((s) => s.code === 'LEJ-W1')!;
    const invited = await admin.post('/api/people').send({ email: 'ext.audit@certbody.test', name: 'Ruth Adeyemi', siteId: leipzig.id, roles: ['auditor'], accessEndsOn: '2026-03-06' });
    expect(invited.status).toBe(201);
    expect(invited.body.accessEndsOn).toBe('2026-03-06');
    const token = await linkToken(t.mails().at(-1)!);
    expect((await t.request().post('/api/password/set').send({ token, password: 'register drill on a wet tuesday' })).status).toBe(200);

    t.clock.set('2026-03-06T22:59:00Z'); // 23:59 in Leipzig on the last day
    const ext = await signIn(t, 'ext.audit@certbody.test', 'register drill on a wet tuesday');
    expect((await ext.get('/api/register')).status).toBe(200);
    expect((await ext.post('/api/findings').send({ entity: 'person', entityId: tech.id, severity: 'minor', text: 'Suspension reason lacks the date of the inspection.' })).status).toBe(201);

    t.clock.set('2026-03-06T23:00:01Z');
    expect((await ext.get('/api/register')).status, 'the open session stops too').toBe(401);
    const again = await t.request().post('/api/session').send({ email: 'ext.audit@certbody.test', password: 'register drill on a wet tuesday' });
    expect(again.status).toBe(401);
    expect(again.body.error.code).toBe('access_ended');
  });
});
