import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { linkToken } from '../support/mail.js';

// A new password ends the sessions the old one opened: all but the changer's own after a change, all after a reset.
let t: TestApp;
const NEW_PASSWORD = 'copper kettle on the seventh shelf';

beforeAll(async () => {
  t = await makeTestApp();
});

const sessionsOf = async (userId: string) =>
  Number((await t.ownerQuery(`select count(*)::int as n from "session" where sess->>'userId' = $1`, [userId])).rows[0].n);

describe('sessions end with the old password', () => {
  it('when a person changes their password, then their other sessions answer 401 and the current one still works', async () => {
    const laptop = await signIn(t, DEMO.technician);
    const tablet = await signIn(t, DEMO.technician);
    const other = await signIn(t, DEMO.technician2);
    expect(await sessionsOf(laptop.user.id)).toBe(2);
    const res = await laptop.put('/api/session/password').send({ currentPassword: DEMO_PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status, JSON.stringify(res.body)).toBe(204);
    expect((await tablet.get('/api/session')).status).toBe(401);
    expect((await laptop.get('/api/session')).status).toBe(200);
    expect((await other.get('/api/session')).status).toBe(200);
    expect(await sessionsOf(laptop.user.id)).toBe(1);
    const audit = await t.ownerQuery(`select new_values from audit_log where action = 'account.password_changed' and entity_id = $1`, [laptop.user.id]);
    expect(audit.rows.map((r) => r.new_values)).toEqual([{ sessionsEnded: 1 }]);
  });

  it('when the current password is wrong, then no session ends', async () => {
    const a = await signIn(t, DEMO.technician2);
    const b = await signIn(t, DEMO.technician2);
    const res = await a.put('/api/session/password').send({ currentPassword: 'not my password at all', newPassword: NEW_PASSWORD });
    expect(res.status).toBe(422);
    expect((await b.get('/api/session')).status).toBe(200);
    expect((await a.get('/api/session')).status).toBe(200);
  });

  it('when a password is set through the e-mailed link, then every old session answers 401', async () => {
    const a = await signIn(t, DEMO.assessor);
    const b = await signIn(t, DEMO.assessor);
    expect((await t.request().post('/api/password/forgot').send({ email: DEMO.assessor })).status).toBe(202);
    const token = await linkToken(t.mails().at(-1)!);
    const set = await b.post('/api/password/set').send({ token, password: NEW_PASSWORD });
    expect(set.status, JSON.stringify(set.body)).toBe(200);
    expect((await a.get('/api/session')).status).toBe(401);
    expect((await b.get('/api/session')).status).toBe(401);
    expect(await sessionsOf(a.user.id)).toBe(0);
    expect((await t.request().post('/api/session').send({ email: DEMO.assessor, password: NEW_PASSWORD })).status).toBe(200);
  });
});
