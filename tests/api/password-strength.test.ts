import { beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { linkToken } from '../support/mail.js';

let t: TestApp;
let manager: Awaited<ReturnType<typeof signIn>>;
let siteId: string;

beforeAll(async () => {
  t = await makeTestApp();
  manager = await signIn(t, DEMO.manager2);
  siteId = (await manager.get('/api/sites')).body.find((s: { code: string }) => s.code === 'CLE-L2').id;
});

async function invite(email: string, name: string) {
  const res = await manager.post('/api/people').send({ email, name, siteId, roles: ['technician'] });
  expect(res.status).toBe(201);
  // Outbox files written at the same clock moment sort in no set order, so pick this person's own mail.
  return linkToken(t.mails().find((m) => m.includes(`To: ${email}`))!);
}

describe('a new password through an invitation link', () => {
  it('when the person sets password12345678, then 422 names the field, and they cannot sign in with it', async () => {
    const token = await invite('rosa.baptiste@example.test', 'Rosa Baptiste');
    const res = await t.request().post('/api/password/set').send({ token, password: 'password12345678' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.password).toMatch(/^this password is too common/);
    const session = await t.request().post('/api/session').send({ email: 'rosa.baptiste@example.test', password: 'password12345678' });
    expect(session.status).toBe(401);
    // The link was not spent on the refused attempt.
    expect((await t.request().post('/api/password/set').send({ token, password: 'maple cobalt river thimble' })).status).toBe(200);
  });

  it('when the password holds the person\'s name without its accents, then 422 says not to use the name', async () => {
    const token = await invite('j.ib@example.test', 'José Ibáñez');
    const res = await t.request().post('/api/password/set').send({ token, password: 'ibanez at the lamp bench' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.password).toMatch(/do not use your name, e-mail/);
  });
});

describe('changing one\'s own password', () => {
  it('when the new one is a common password dressed up with look-alikes and digits, then 422 names newPassword', async () => {
    const tech = await signIn(t, DEMO.technician3);
    const res = await tech.put('/api/session/password').send({ currentPassword: DEMO_PASSWORD, newPassword: 'p@ssw0rd1234567' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.newPassword).toMatch(/too common/);
    expect((await t.request().post('/api/session').send({ email: DEMO.technician3, password: DEMO_PASSWORD })).status).toBe(200);
  });
});
