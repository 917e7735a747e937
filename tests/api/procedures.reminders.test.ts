import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { createApp } from '../../server/app.js';
import { loadConfig } from '../../server/config.js';
import { freePort } from '../../scripts/lib/ports.js';
import { makeTestApp, withOrigin, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { parseEml } from '../support/mail.js';
import { deliverMail } from '../support/deliver.js';
import { publishNew } from '../support/procedures.js';

let t: TestApp;
type Agent = Awaited<ReturnType<typeof signIn>>;
let manager: Agent, manager2: Agent, admin: Agent, tech: Agent;

beforeAll(async () => {
  t = await makeTestApp();
  [manager, manager2, admin, tech] = await Promise.all([DEMO.manager, DEMO.manager2, DEMO.admin, DEMO.technician].map((e) => signIn(t, e)));
  // Owned in Leipzig (Jörg manages it) and in Cleveland (Dana, and Jörg who covers Cleveland); both due 2 April.
  await publishNew(manager, manager2, { reviewPeriodMonths: 1 }, 'REM-LEJ-1');
  await publishNew(manager2, manager, { reviewPeriodMonths: 1 }, 'REM-CLE-1');
});

/** The review reminders for this file's procedures that reached the outbox since `before`, as "to code". */
async function newReminders(before: Set<string>, code = 'REM-') {
  const mails = await Promise.all(t.mails().filter((m) => !before.has(m)).map(parseEml));
  return mails.filter((m) => m.subject.includes(code)).map((m) => `${m.to} ${m.subject.match(/REM-[A-Z]+-\d/)![0]}`).sort();
}

async function sweepAt(when: string, agent: Agent = manager, code?: string) {
  t.clock.set(when);
  const before = new Set(t.mails());
  const res = await agent.post('/api/procedures/review-reminders/run').send({});
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return newReminders(before, code);
}

describe('review-due reminders', () => {
  afterAll(() => t.clock.set('2026-03-02T09:00:00Z'));

  it('when nothing is due within the largest offset, then nothing is sent', async () => {
    expect(await sweepAt('2026-03-02T10:00:00Z')).toEqual([]);
  });

  it('when a review comes within 30 days, then each manager of the owning site gets one message, once', async () => {
    expect(await sweepAt('2026-03-04T07:00:00Z')).toEqual([
      `${DEMO.manager2} REM-CLE-1`, `${DEMO.manager} REM-CLE-1`, `${DEMO.manager} REM-LEJ-1`,
    ].sort());
    expect(await sweepAt('2026-03-04T08:00:00Z', admin)).toEqual([]);
    expect(await sweepAt('2026-03-20T08:00:00Z')).toEqual([]);
  });

  it('when the next offset is reached and then the date passes, then one more each time', async () => {
    const seven = await sweepAt('2026-03-27T08:00:00Z');
    expect(seven).toHaveLength(3);
    expect(await sweepAt('2026-03-27T09:00:00Z')).toEqual([]);
    t.clock.set('2026-04-03T08:00:00Z');
    const before = new Set(t.mails());
    await manager.post('/api/procedures/review-reminders/run').send({});
    const overdue = (await Promise.all(t.mails().filter((m) => !before.has(m)).map(parseEml))).filter((m) => /REM-/.test(m.subject));
    expect(overdue).toHaveLength(3);
    expect(overdue[0].subject).toMatch(/^Review overdue: REM-/);
    expect(overdue[0].text).toContain('was due on 2026-04-02');
  });

  it('when the first sweep runs late, then only the nearest offset is sent, not every one passed', async () => {
    t.clock.set('2026-03-02T09:00:00Z');
    await publishNew(manager, manager2, { reviewPeriodMonths: 1 }, 'REM-LATE-1');
    expect(await sweepAt('2026-03-30T08:00:00Z')).toEqual([`${DEMO.manager} REM-LATE-1`]);
    const rows = await t.ownerQuery(`select offset_days from procedure_review_reminders r join procedure_versions v on v.id = r.version_id join procedures p on p.id = v.procedure_id where p.code = 'REM-LATE-1'`);
    expect(rows.rows.map((r) => r.offset_days)).toEqual([7]);
  });

  it('when a send fails, then the reminder stays pending and the next run (another instance) sends it exactly once', async () => {
    t.clock.set('2026-03-02T09:00:00Z');
    await publishNew(manager2, manager, { reviewPeriodMonths: 1 }, 'REM-FAIL-1');
    // A second server on the same database whose mail server cannot be reached.
    const broken = createApp({
      config: loadConfig({ ...process.env, DATABASE_URL: t.database.url, PUBLIC_URL: 'http://breakover.test', SESSION_SECRET: 'x'.repeat(40), SMTP_URL: `smtp://127.0.0.1:${await freePort()}`, SIGNIN_RATE_LIMIT: '1000' }),
      clock: t.clock,
    });
    try {
      t.clock.set('2026-03-10T08:00:00Z');
      const agent = withOrigin(broken.app);
      await agent.post('/api/session').send({ email: DEMO.manager, password: DEMO_PASSWORD });
      const failed = await agent.post('/api/procedures/review-reminders/run').send({});
      expect(failed.status).toBe(200);
      // That server has no job queue: its delivery runs here, and its mail server refuses the connection.
      expect((await deliverMail(broken)).sent).toBe(0);
      const pending = await t.ownerQuery(`select count(*)::int as n from procedure_review_reminders r join procedure_versions v on v.id = r.version_id
        join procedures p on p.id = v.procedure_id where p.code = 'REM-FAIL-1' and r.sent_at is null and r.last_error is not null`);
      expect(pending.rows[0].n).toBe(2);
    } finally {
      await broken.close();
    }
    expect(await sweepAt('2026-03-10T09:00:00Z', manager, 'REM-FAIL-1')).toEqual([`${DEMO.manager2} REM-FAIL-1`, `${DEMO.manager} REM-FAIL-1`].sort());
    expect(await sweepAt('2026-03-10T10:00:00Z', manager, 'REM-FAIL-1')).toEqual([]);
  });

  it('when two instances sweep at the same moment, then each reminder still goes out once', async () => {
    t.clock.set('2026-03-02T09:00:00Z');
    await publishNew(manager2, manager, { reviewPeriodMonths: 1 }, 'REM-TWIN-1');
    const twin = createApp({ config: { ...t.config }, clock: t.clock });
    try {
      t.clock.set('2026-03-12T08:00:00Z');
      const other = withOrigin(twin.app);
      await other.post('/api/session').send({ email: DEMO.manager2, password: DEMO_PASSWORD });
      const before = new Set(t.mails());
      const [a, b] = await Promise.all([manager.post('/api/procedures/review-reminders/run').send({}), other.post('/api/procedures/review-reminders/run').send({})]);
      expect([a.status, b.status]).toEqual([200, 200]);
      // What the twin recorded is delivered by the next delivery run, which may be this app's.
      await deliverMail(t);
      // Both instances write into the same outbox folder here, so the folder shows every message either sent.
      expect(await newReminders(before, 'REM-TWIN-1')).toEqual([`${DEMO.manager2} REM-TWIN-1`, `${DEMO.manager} REM-TWIN-1`].sort());
    } finally {
      await twin.close();
    }
  });

  it('when the scheduled run finds nothing new, then it leaves no entry in the audit trail; when it records reminders, then one entry says how many', async () => {
    const sweeps = async () => (await t.ownerQuery(`select new_values from audit_log where action = 'procedure.review_sweep' and actor_id is null order by id`)).rows.map((r) => r.new_values);
    const before = (await sweeps()).length;
    t.clock.set('2026-03-02T09:30:00Z');
    await t.services.procedures.reminders.run(null, [30, 7, 0]);
    await t.services.procedures.reminders.run(null, [30, 7, 0]);
    expect((await sweeps()).length, 'nothing due: nothing written').toBe(before);
    await publishNew(manager, manager2, { reviewPeriodMonths: 1 }, 'REM-TRAIL-1');
    t.clock.set('2026-03-05T09:00:00Z');
    await t.services.procedures.reminders.run(null, [30, 7, 0]);
    await t.services.procedures.reminders.run(null, [30, 7, 0]);
    const after = await sweeps();
    expect(after.length).toBe(before + 1);
    expect(after.at(-1)).toMatchObject({ recorded: 1 });
  });

  it('when a technician asks for a sweep, then 403', async () => {
    expect((await tech.post('/api/procedures/review-reminders/run').send({})).status).toBe(403);
  });
});
