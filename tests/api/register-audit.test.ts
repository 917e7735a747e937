import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { makeScope, mineFor, newPerson, submitCertificate, verifyCertificate } from '../support/authorisations.js';
import { seal, tamper } from '../support/audit.js';

let t: TestApp;
let auditor: Awaited<ReturnType<typeof signIn>>;
let manager: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  auditor = await signIn(t, DEMO.auditor);
  manager = await signIn(t, DEMO.manager);
});

describe('the audit trail view', () => {
  it('when filtered by person, record, action and time, then only matching entries come back, newest first, with old and new values', async () => {
    t.clock.set('2026-03-03T08:00:00Z');
    const scope = await makeScope(manager, { validityMonths: 12 });
    const tech = await newPerson(t);
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    const a = (await mineFor(tech, scope.id))!;
    t.clock.set('2026-03-04T08:00:00Z');
    expect((await manager.post(`/api/authorisations/${a.id}/revoke`).send({ reason: 'Left the live-work team', password: DEMO_PASSWORD })).status).toBe(200);

    const byRecord = await auditor.get('/api/audit').query({ entity: 'authorisation_period', entityId: a.periodId });
    expect(byRecord.status).toBe(200);
    expect(byRecord.body.items.map((e: { action: string }) => e.action)).toEqual(['authorisation.expiry_changed', 'authorisation.revoked', 'signature.made', 'authorisation.issued']);
    const moved = byRecord.body.items[0];
    expect(moved.oldValues).toEqual({ endsAt: '2027-03-03T23:00:00.000Z' });
    expect(moved.newValues).toMatchObject({ endsAt: '2026-03-04T08:00:00.000Z', reason: 'Revoked.' });

    const manId = manager.user.id;
    const revokes = await auditor.get('/api/audit').query({ actorId: manId, action: 'authorisation.revoked' });
    expect(revokes.body.items.map((e: { entityId: string; actorName: string }) => [e.entityId, e.actorName])).toEqual([[a.periodId, 'Jörg Łukasik']]);
    const kind = await auditor.get('/api/audit').query({ action: 'authorisation.', from: '2026-03-04T00:00:00Z', to: '2026-03-05T00:00:00Z' });
    expect(kind.body.items.every((e: { action: string; at: string }) => e.action.startsWith('authorisation.') && e.at.startsWith('2026-03-04'))).toBe(true);
    expect(kind.body.total).toBe(2);
    const empty = await auditor.get('/api/audit').query({ from: '2026-03-05T00:00:00Z', to: '2026-03-06T00:00:00Z' });
    expect(empty.body).toMatchObject({ items: [], total: 0 });
  });

  it('when the filter is malformed, then it answers 400 naming the field', async () => {
    const res = await auditor.get('/api/audit').query({ from: '2026-03-05T00:00:00Z', to: '2026-03-01T00:00:00Z' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('query.to');
    expect((await auditor.get('/api/audit').query({ action: 'DROP TABLE' })).body.error.fields).toHaveProperty('query.action');
  });

  it('when a manager or a technician asks for the trail or its verification, then it is refused', async () => {
    const tech = await signIn(t, DEMO.technician);
    for (const agent of [manager, tech]) {
      expect((await agent.get('/api/audit')).status).toBe(403);
      expect((await agent.post('/api/audit/verify')).status).toBe(403);
    }
  });

  it('when the chain is verified through the route, then it is intact with the count; altered behind the guard, the route names that entry', async () => {
    await seal(t);
    const ok = await auditor.post('/api/audit/verify');
    expect(ok.status).toBe(200);
    const count = Number((await t.ownerQuery('select count(*) as n from audit_log')).rows[0].n);
    expect(ok.body).toMatchObject({ intact: true, entries: count, sealed: count, unsealed: 0 });

    const target = Number((await t.ownerQuery(`select id from audit_log where action = 'authorisation.revoked' order by id limit 1`)).rows[0].id);
    await tamper(t, `update audit_log set new_values = jsonb_set(new_values, '{reason}', '"Nothing happened"') where id = ${target}`);
    const bad = await auditor.post('/api/audit/verify');
    expect(bad.status).toBe(200);
    expect(bad.body).toMatchObject({ intact: false, issueCount: 1 });
    expect(bad.body.issues[0]).toMatchObject({ kind: 'edited', entryId: target, entry: { id: target, action: 'authorisation.revoked', newValues: { reason: 'Nothing happened' } } });
  });
});
