import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});

describe('sign-in', () => {
  it('when the password is right, then the session user comes back with roles and site', async () => {
    const agent = t.agent();
    const res = await agent.post('/api/session').send({ email: DEMO.manager, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.roles).toEqual(['manager']);
    expect(res.body.site.personTerm).toBe('skilled person');
    expect(res.headers['set-cookie'][0]).toMatch(/HttpOnly/);
    expect(res.headers['set-cookie'][0]).toMatch(/SameSite=Lax/);
    const me = await agent.get('/api/session');
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(DEMO.manager);
  });

  it('when the password is wrong or the e-mail unknown, then both answers are the same 401', async () => {
    const wrong = await t.request().post('/api/session').send({ email: DEMO.technician2, password: 'not-the-password-at-all' });
    const unknown = await t.request().post('/api/session').send({ email: 'nobody@demo.breakover.test', password: 'not-the-password-at-all' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    // Each answer carries its own request id; everything else must be the same.
    const same = (b: { error: { requestId?: string } }) => ({ ...b.error, requestId: undefined });
    expect(same(unknown.body)).toEqual(same(wrong.body));
    expect(unknown.body.error.requestId).not.toEqual(wrong.body.error.requestId);
  });

  it('when five wrong passwords are given, then the account is locked even for the right one, until the lock ends', async () => {
    for (let i = 0; i < 5; i++) {
      await t.request().post('/api/session').send({ email: DEMO.technician3, password: 'wrong-password-guess-' + i });
    }
    const locked = await t.request().post('/api/session').send({ email: DEMO.technician3, password: DEMO_PASSWORD });
    expect(locked.status).toBe(401);
    expect(locked.body.error.code).toBe('locked');
    t.clock.advance(16 * 60_000);
    const after = await t.request().post('/api/session').send({ email: DEMO.technician3, password: DEMO_PASSWORD });
    expect(after.status).toBe(200);
  });

  it('when a person is deactivated, then they cannot sign in and their open session ends', async () => {
    const tech = await signIn(t, DEMO.technician2);
    const admin = await signIn(t, DEMO.admin);
    const off = await admin.patch(`/api/people/${tech.user.id}`).send({ active: false, deactivatedReason: 'left the company' });
    expect(off.status).toBe(200);
    expect((await tech.get('/api/session')).status).toBe(401);
    const again = await t.request().post('/api/session').send({ email: DEMO.technician2, password: DEMO_PASSWORD });
    expect(again.status).toBe(401);
    expect(again.body.error.code).toBe('deactivated');
  });

  it('when signing out, then the session is destroyed', async () => {
    const agent = await signIn(t, DEMO.auditor);
    expect((await agent.delete('/api/session')).status).toBe(204);
    expect((await agent.get('/api/session')).status).toBe(401);
  });

  it('when signed in, then the session id is a new one (not the one held before)', async () => {
    const agent = t.agent();
    await agent.post('/api/session').send({ email: DEMO.assessor, password: DEMO_PASSWORD });
    const first = (await agent.post('/api/session').send({ email: DEMO.assessor, password: DEMO_PASSWORD })).headers['set-cookie'][0];
    const second = (await agent.post('/api/session').send({ email: DEMO.assessor, password: DEMO_PASSWORD })).headers['set-cookie'][0];
    expect(first.split(';')[0]).not.toBe(second.split(';')[0]);
  });

  it('when a write comes from a foreign origin, then it is refused', async () => {
    const res = await t.request().post('/api/session').set('Origin', 'http://evil.example').send({ email: DEMO.admin, password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
  });

  it('health reports the database', async () => {
    const res = await t.request().get('/api/health');
    expect(res.body).toEqual({ status: 'ok', database: 'up' });
  });

  it('unknown API routes answer with a JSON 404', async () => {
    const res = await t.request().get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('no_route');
  });
});
