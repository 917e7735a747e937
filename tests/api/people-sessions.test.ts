import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, signIn } from '../support/people.js';
import { personSnapshot } from '../support/person-snapshot.js';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await makeTestApp();
  admin = await signIn(t, DEMO.admin);
});

const lastAudit = async () => (await t.ownerQuery('select action, entity_id, new_values from audit_log order by id desc limit 1')).rows[0];

describe('switching a person off ends their sessions', () => {
  it('when an admin switches a technician off, then their old cookies answer 401, and still 401 after they are switched on again', async () => {
    const used = await signIn(t, DEMO.technician2);
    const unused = await signIn(t, DEMO.technician2);
    const id = used.user.id;
    expect((await personSnapshot(t, id)).sessions).toBe(2);
    const off = await admin.patch(`/api/people/${id}`).send({ active: false, deactivatedReason: 'Left the workshop' });
    expect(off.status).toBe(200);
    expect((await personSnapshot(t, id)).sessions, 'deleted in the same change').toBe(0);
    expect(await lastAudit()).toMatchObject({ action: 'person.deactivated', entity_id: id, new_values: { sessionsEnded: 2 } });
    expect((await used.get('/api/session')).status).toBe(401);

    expect((await admin.patch(`/api/people/${id}`).send({ active: true })).status).toBe(200);
    expect((await used.get('/api/session')).status).toBe(401);
    expect((await unused.get('/api/session')).status, 'a cookie not used while switched off does not come back either').toBe(401);
    expect((await signIn(t, DEMO.technician2)).user.id, 'a fresh sign-in works').toBe(id);
  });
});

describe('DELETE /api/people/:id/sessions', () => {
  it('when an admin ends all sessions of a person, then the answer counts them, their old cookies answer 401 and it is audited', async () => {
    const a = await signIn(t, DEMO.technician);
    const b = await signIn(t, DEMO.technician);
    const res = await admin.delete(`/api/people/${a.user.id.toUpperCase()}/sessions`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ended: 2 });
    expect((await a.get('/api/session')).status).toBe(401);
    expect((await b.get('/api/session')).status).toBe(401);
    expect(await lastAudit()).toMatchObject({ action: 'person.sessions_ended', entity_id: a.user.id, new_values: { ended: 2 } });
  });

  it('when an admin ends their own sessions, then the others end and the one they use stays', async () => {
    const elsewhere = await signIn(t, DEMO.admin);
    const res = await admin.delete(`/api/people/${admin.user.id}/sessions`);
    expect(res.body).toEqual({ ended: 1 });
    expect((await elsewhere.get('/api/session')).status).toBe(401);
    expect((await admin.get('/api/session')).status).toBe(200);
  });

  it('when a manager asks, then 403 and the sessions stay', async () => {
    const manager = await signIn(t, DEMO.manager);
    const tech = await signIn(t, DEMO.technician);
    const before = await personSnapshot(t, tech.user.id);
    const res = await manager.delete(`/api/people/${tech.user.id}/sessions`);
    expect(res.status).toBe(403);
    expect(await personSnapshot(t, tech.user.id)).toEqual(before);
    expect((await tech.get('/api/session')).status).toBe(200);
  });

  it('when the person does not exist, then 404 and nothing is audited', async () => {
    const audit = (await personSnapshot(t, admin.user.id)).audit;
    const res = await admin.delete('/api/people/00000000-0000-4000-8000-00000000abcd/sessions');
    expect(res.status).toBe(404);
    expect((await personSnapshot(t, admin.user.id)).audit).toBe(audit);
  });
});
