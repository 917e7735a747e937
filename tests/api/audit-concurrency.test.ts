import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD } from '../support/people.js';
import { seal, smallWrite, verify } from '../support/audit.js';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
  await verify(t);
  await seal(t);
});

/** Resolves with the promise's value, or rejects when it has not settled within `ms` (a bounded wait). */
const within = <T>(p: Promise<T>, ms: number, what: string) =>
  Promise.race([p, new Promise<never>((_, reject) => setTimeout(() => reject(new Error(`${what} still waiting after ${ms} ms`)), ms))]);

const entriesOf = async (where: string) => (await t.ownerQuery(`select l.id, s.entry_id is not null as sealed from audit_log l left join audit_seal s on s.entry_id = l.id where ${where} order by l.id`)).rows;

describe('audit trail under a long transaction', () => {
  it('when a long transaction holds many entries, then a sign-in and a small write commit first; the chain seals all of them once it commits', async () => {
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    let started!: () => void;
    const appended = new Promise<void>((r) => (started = r));
    const long = t.deps.db.transaction(async (tx) => {
      for (let i = 0; i < 300; i++) await t.deps.audit(tx, { actorId: null, action: 'test.long', entity: 'test', entityId: String(i), newValues: { i } });
      started();
      await held;
    });
    await appended;
    let longOpen = true;
    void long.finally(() => (longOpen = false));

    const signIn = await within(t.request().post('/api/session').send({ email: DEMO.technician, password: DEMO_PASSWORD }), 10_000, 'sign-in');
    expect(signIn.status).toBe(200);
    await within(smallWrite(t, 'small'), 10_000, 'small write');
    expect(longOpen).toBe(true);
    expect(await entriesOf(`l.action in ('session.signed_in', 'test.small') and l.entity_id in ('small', '${signIn.body.id}')`)).toHaveLength(2);

    // The sealer never seals past the open transaction's entries: what followed them waits.
    const during = await seal(t, { waitMs: 200 });
    expect(during.caughtUp).toBe(false);
    expect((await entriesOf(`l.action = 'test.small'`)).map((r) => r.sealed)).toEqual([false]);
    expect((await verify(t)).intact).toBe(true);

    release();
    await long;
    const after = await seal(t);
    expect(after.caughtUp).toBe(true);
    const report = await verify(t);
    expect(report).toMatchObject({ intact: true, issueCount: 0 });
    const ours = await entriesOf(`l.action in ('test.long', 'test.small') or (l.action = 'session.signed_in' and l.entity_id = '${signIn.body.id}')`);
    expect(ours).toHaveLength(302);
    expect(ours.every((r) => r.sealed)).toBe(true);
    expect(report.unsealed).toBe(0);
  });
});
