import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';

// One password check for sign-in, signatures and password changes: the same count, the same lock.
let t: TestApp;
let N: number;
let benchId: string;
const LOCK_MINUTES = 15;

beforeAll(async () => {
  t = await makeTestApp();
  N = t.config.signIn.lockoutThreshold;
  const manager = await signIn(t, DEMO.manager);
  benchId = (await manager.get('/api/benches').query({ pageSize: 100 })).body.items.find((b: { code: string }) => b.code === 'LEJ-B1').id;
});

const signCheck = (agent: Awaited<ReturnType<typeof signIn>>, password: string) =>
  agent.post(`/api/benches/${benchId}/pre-use-checks`).send({ passed: true, password });
const wrongSignIn = (email: string) => t.request().post('/api/session').send({ email, password: 'not the password at all' });
const count = async (sql: string, id: string) => Number((await t.ownerQuery(sql, [id])).rows[0].n);
const signed = (userId: string) => count('select count(*)::int as n from signatures where signer_id = $1', userId);
const checks = (userId: string) => count('select count(*)::int as n from bench_checks where person_id = $1', userId);
const locks = (userId: string) => count(`select count(*)::int as n from audit_log where action = 'account.locked' and entity_id = $1`, userId);

describe('one password check for sign-in and signatures', () => {
  it('when N wrong signature passwords are given, then the account locks as after N wrong sign-ins, and nothing is signed', async () => {
    const tech = await signIn(t, DEMO.technician);
    const [signedBefore, checksBefore] = [await signed(tech.user.id), await checks(tech.user.id)];
    for (let i = 1; i < N; i++) {
      const res = await signCheck(tech, `wrong guess number ${i}`);
      expect(res.status).toBe(422);
      expect(res.body.error.fields).toEqual({ password: 'the password is not right' });
    }
    const last = await signCheck(tech, 'wrong guess, the last one');
    expect(last.status).toBe(401);
    expect(last.body.error.code).toBe('locked');
    expect(last.body.error.fields.password).toBe(`this account is locked for ${LOCK_MINUTES} more minute(s) after too many wrong passwords`);
    expect(await locks(tech.user.id)).toBe(1);

    const right = await signCheck(tech, DEMO_PASSWORD);
    expect(right.status).toBe(401);
    expect(right.body.error.fields.password).toMatch(/^this account is locked for 15 more minute/);
    const again = await t.request().post('/api/session').send({ email: DEMO.technician, password: DEMO_PASSWORD });
    expect(again.status).toBe(401);
    expect(again.body.error.code).toBe('locked');
    expect(await signed(tech.user.id)).toBe(signedBefore);
    expect(await checks(tech.user.id)).toBe(checksBefore);

    t.clock.advance(LOCK_MINUTES * 60_000 + 1000);
    expect((await signCheck(tech, DEMO_PASSWORD)).status).toBe(201);
    expect(await signed(tech.user.id)).toBe(signedBefore + 1);
    expect((await t.request().post('/api/session').send({ email: DEMO.technician, password: DEMO_PASSWORD })).status).toBe(200);
  });

  it('when wrong sign-ins and wrong signatures add up to N, then the account is locked for both', async () => {
    const tech = await signIn(t, DEMO.technician2);
    const [signedBefore, checksBefore] = [await signed(tech.user.id), await checks(tech.user.id)];
    for (let i = 0; i < 2; i++) expect((await wrongSignIn(DEMO.technician2)).body.error.code).toBe('bad_credentials');
    for (let i = 2; i < N - 1; i++) expect((await signCheck(tech, `wrong guess ${i}`)).status).toBe(422);
    const last = await wrongSignIn(DEMO.technician2);
    expect(last.status).toBe(401);
    expect(last.body.error.message).toBe(`This account is locked for ${LOCK_MINUTES} more minute(s) after too many wrong passwords.`);
    const refused = await signCheck(tech, DEMO_PASSWORD);
    expect(refused.status).toBe(401);
    expect(refused.body.error.code).toBe('locked');
    expect(await signed(tech.user.id)).toBe(signedBefore);
    expect(await checks(tech.user.id)).toBe(checksBefore);
    t.clock.advance(LOCK_MINUTES * 60_000 + 1000);
  });

  it('when the right password signs after a few wrong ones, then the count starts again', async () => {
    const me = await signIn(t, DEMO.assessor);
    for (let i = 1; i < N; i++) expect((await signCheck(me, `wrong guess ${i}`)).status).toBe(422);
    expect((await signCheck(me, DEMO_PASSWORD)).status).toBe(201);
    for (let i = 1; i < N; i++) expect((await signCheck(me, `wrong guess ${i}`)).status).toBe(422);
    expect((await signCheck(me, DEMO_PASSWORD)).status).toBe(201);
    expect(await locks(me.user.id)).toBe(0);
  });

  it('when the current password given to change it is wrong, then it counts too, and a locked account cannot change it', async () => {
    const me = await signIn(t, DEMO.auditor);
    const change = (current: string) => me.put('/api/session/password').send({ currentPassword: current, newPassword: 'a fresh walnut ledger 42' });
    for (let i = 1; i < N; i++) {
      const res = await change(`wrong current ${i}`);
      expect(res.status).toBe(422);
      expect(res.body.error.fields).toEqual({ currentPassword: 'the current password is not right' });
    }
    expect((await change('wrong current, the last')).body.error.fields.currentPassword).toMatch(/^this account is locked for 15 more minute/);
    const refused = await change(DEMO_PASSWORD);
    expect(refused.status).toBe(401);
    expect(refused.body.error.code).toBe('locked');
    expect(refused.body.error.fields).toHaveProperty('currentPassword');
    // Still the old password: nothing changed while locked.
    t.clock.advance(LOCK_MINUTES * 60_000 + 1000);
    expect((await t.request().post('/api/session').send({ email: DEMO.auditor, password: DEMO_PASSWORD })).status).toBe(200);
  });
});
