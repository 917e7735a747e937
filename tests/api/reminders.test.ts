import { describe, it, expect, beforeAll } from 'vitest';
import { makeJobsTestApp, type JobsTestApp } from '../support/jobs.js';
import { DEMO, DEMO_PASSWORD } from '../support/people.js';
import { parseEml } from '../support/mail.js';
import { makeScope, newPerson, submitCertificate, verifyCertificate, type Person } from '../support/authorisations.js';
import type { TestApp } from '../support/app.js';
import { QUEUES } from '../../server/jobs/queues.js';

let t: JobsTestApp;
let manager: ReturnType<JobsTestApp['agent']>;

beforeAll(async () => {
  t = await makeJobsTestApp();
  manager = t.agent();
  await manager.post('/api/session').send({ email: DEMO.manager, password: DEMO_PASSWORD });
});

// The helpers expect a TestApp; this one has the same parts they use.
const app = () => t as unknown as TestApp;

describe('exactly-once reminders with two server processes', () => {
  it('when two processes sweep the same database at the same moment, then each (period, offset, recipient) is recorded once and mailed once', async () => {
    const scope = await makeScope(manager, { title: 'Live testing behind an isolating transformer and 30 mA RCD', reminderOffsetsDays: [60, 30, 7] });
    const people: Person[] = [];
    for (let i = 0; i < 12; i++) {
      const tech = await newPerson(app());
      await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
      people.push(tech);
    }
    // 41 days before the end of 2 March 2027: the 60-day reminder is due.
    const at = new Date('2027-01-20T09:00:00Z');
    t.clock.set(at);
    const second = await t.startSecondWorker(at);
    const ids = await Promise.all(Array.from({ length: 8 }, () => t.jobs.boss!.send(QUEUES.sweep, { requestedBy: 'test' })));
    const jobs = await t.waitForJobs(ids as string[]);
    expect(jobs.every((j) => j.state === 'completed'), JSON.stringify(jobs.map((j) => j.output))).toBe(true);
    const pids = new Set(jobs.map((j) => (j.output as { pid: number }).pid));
    expect(pids, 'both processes swept').toEqual(new Set([process.pid, second.pid]));

    const sends = (await t.ownerQuery(
      `select r.id, r.offset_days, r.status, r.mail_id, u.email from reminder_sends r join users u on u.id = r.recipient_id
       join authorisation_periods p on p.id = r.period_id where p.scope_id = $1`, [scope.id])).rows;
    // Each holder and Jörg Łukasik, the one manager of the Leipzig site.
    expect(sends.length).toBe(people.length * 2);
    expect(sends.every((s) => s.status === 'sent' && s.offset_days === 60)).toBe(true);
    const mails = await Promise.all(t.mails().map(parseEml));
    const ours = mails.filter((m) => m.subject.includes(scope.title));
    expect(ours.length, 'one .eml per recorded send').toBe(sends.length);
    const keys = ours.map((m) => `${m.to}|${m.subject}`);
    expect(new Set(keys).size).toBe(keys.length);
    for (const p of people) expect(keys.filter((k) => k.startsWith(`${p.email}|`)).length).toBe(1);
    const logged = (await t.ownerQuery(`select id from mail_log where status = 'sent' and subject like $1`, [`%${scope.title}%`])).rows.map((r) => r.id).sort();
    expect(logged).toEqual(sends.map((s) => s.mail_id).sort());

    const holderMail = ours.find((m) => m.to === people[0].email)!;
    expect(holderMail.subject).toBe(`Your authorisation “${scope.title}” lapses on 2 Mar 2027`);
    expect(holderMail.text).toMatch(/lapses at the end of 2 Mar 2027, in 41 days/);
    expect(holderMail.text).toMatch(/To renew it before then:\n {2}- Meet the requirements again:/);
    expect(holderMail.text).toContain('http://breakover.test/authorisations/mine');
    const managerMail = ours.find((m) => m.to === DEMO.manager && m.subject.startsWith(`${people[0].name}'s `))!;
    expect(managerMail.text).toMatch(new RegExp(`${people[0].name}'s authorisation \\(Leipzig bench workshop\\)`));

    // A later sweep by both at the 30-day mark adds exactly the next reminder.
    const later = new Date('2027-02-05T09:00:00Z');
    t.clock.set(later);
    await t.stopSecondWorkers();
    await t.startSecondWorker(later);
    const more = await Promise.all(Array.from({ length: 6 }, () => t.jobs.boss!.send(QUEUES.sweep, {})));
    await t.waitForJobs(more as string[]);
    const offsets = (await t.ownerQuery(`select r.offset_days, count(*)::int as n from reminder_sends r join authorisation_periods p on p.id = r.period_id where p.scope_id = $1 group by 1 order by 1`, [scope.id])).rows;
    expect(offsets).toEqual([{ offset_days: 30, n: people.length * 2 }, { offset_days: 60, n: people.length * 2 }]);
    expect((await Promise.all(t.mails().map(parseEml))).filter((m) => m.subject.includes(scope.title)).length).toBe(people.length * 4);
  }, 120_000); // starts a second server process twice: a loaded machine needs more than the default
});

describe('an end that moves', () => {
  it('when the end a reminder was sent for moves later, then the offset is reminded again for the new end, once', async () => {
    await t.stopSecondWorkers();
    t.clock.set('2026-03-02T09:00:00Z');
    const scope = await makeScope(manager, { title: 'Motor controller live fault-finding (moved end)', reminderOffsetsDays: [30], validityMonths: 12, requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
    const tech = await newPerson(app());
    // The certificate runs out on 30 Sep 2026, before the twelve months: the period ends with it.
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2025-09-30', expiresOn: '2026-09-30' }), DEMO_PASSWORD);
    const ours = async () => (await Promise.all(t.mails().map(parseEml))).filter((m) => m.subject.includes(scope.title) && m.to === tech.email).map((m) => m.subject).sort();
    t.clock.set('2026-09-05T09:00:00Z');
    await t.services.reminders.sweep();
    expect(await ours()).toEqual([`Your authorisation “${scope.title}” lapses on 30 Sept 2026`]);

    // A renewed certificate is verified: the same period runs to the end of its validity again.
    t.clock.set('2026-09-10T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-09-09', expiresOn: '2028-09-09' }), DEMO_PASSWORD);
    await t.services.reminders.sweep();
    expect((await ours()).length, 'nothing new to say yet').toBe(1);

    t.clock.set('2027-02-05T09:00:00Z');
    await t.services.reminders.sweep();
    await t.services.reminders.sweep();
    expect(await ours()).toEqual([`Your authorisation “${scope.title}” lapses on 2 Mar 2027`, `Your authorisation “${scope.title}” lapses on 30 Sept 2026`]);
    const periods = (await t.ownerQuery(`select distinct r.period_id from reminder_sends r join authorisation_periods p on p.id = r.period_id where p.scope_id = $1 and p.holder_id = $2`, [scope.id, tech.id])).rows;
    expect(periods.length, 'both reminders are about the one period').toBe(1);
  });

  it('when the end moves before a planned reminder is delivered, then that reminder is cancelled rather than sent with the wrong date', async () => {
    t.clock.set('2026-03-02T09:00:00Z');
    const scope = await makeScope(manager, { title: 'Dimmer pack repair (pending reminder)', reminderOffsetsDays: [30], validityMonths: 12, requirements: [{ kind: 'certificate', certificateKind: 'first_aid_cpr' }] });
    const tech = await newPerson(app());
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2025-09-30', expiresOn: '2026-09-30' }), DEMO_PASSWORD);
    t.clock.set('2026-09-05T09:00:00Z');
    t.transport.failing = true;
    await t.services.reminders.sweep();
    t.transport.failing = false;
    t.clock.set('2026-09-06T09:00:00Z');
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-09-05', expiresOn: '2028-09-05' }), DEMO_PASSWORD);
    await t.services.reminders.sweep();
    // Only this holder's: a new scope is also issued by the sweep to earlier tests' people who meet it.
    const rows = (await t.ownerQuery(`select r.status from reminder_sends r join authorisation_periods p on p.id = r.period_id where p.scope_id = $1 and p.holder_id = $2`, [scope.id, tech.id])).rows;
    expect(rows.map((r) => r.status)).toEqual(['cancelled', 'cancelled']);
    expect((await Promise.all(t.mails().map(parseEml))).filter((m) => m.subject.includes(scope.title) && m.text.includes(tech.name))).toEqual([]);
  });
});

describe('a transport that fails', () => {
  it('when the mail server refuses, then the reminder stays pending with its error and is never marked sent; once it works, it is sent once', async () => {
    await t.stopSecondWorkers();
    t.clock.set('2026-03-02T09:00:00Z');
    const scope = await makeScope(manager, { title: 'Dead work on mains equipment (retry test)', reminderOffsetsDays: [7], validityMonths: 1 });
    const tech = await newPerson(app());
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-01-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    t.clock.set('2026-03-30T09:00:00Z');
    t.transport.failing = true;
    const before = t.mails().length;
    const res = await manager.post('/api/reminders/sweep');
    expect(res.status).toBe(202);
    const [job] = await t.waitForJobs([res.body.jobId]);
    expect(job.state).toBe('completed');
    const rows = async () => (await t.ownerQuery(
      `select r.status, r.attempts, r.sent_at, r.last_error, r.next_attempt_at from reminder_sends r join authorisation_periods p on p.id = r.period_id where p.scope_id = $1`, [scope.id])).rows;
    const failed = await rows();
    expect(failed.length).toBe(2);
    for (const r of failed) {
      expect(r).toMatchObject({ status: 'pending', attempts: 1, sent_at: null });
      expect(r.last_error).toMatch(/mail service not available/);
      expect(new Date(r.next_attempt_at).getTime(), 'retried after a minute').toBe(new Date('2026-03-30T09:01:00Z').getTime());
    }
    expect(t.mails().length, 'nothing reached the outbox').toBe(before);
    const listed = (await manager.get('/api/reminders').query({ status: 'pending' })).body.items;
    expect(listed.some((i: { lastError: string; attempts: number }) => i.attempts === 1 && /not available/.test(i.lastError))).toBe(true);

    await t.services.reminders.sweep();
    expect((await rows()).map((r) => r.attempts), 'not yet due again').toEqual([1, 1]);

    t.clock.set('2026-03-30T09:03:00Z');
    await t.services.reminders.sweep();
    expect((await rows()).map((r) => r.attempts), 'failed again, waiting longer').toEqual([2, 2]);

    t.transport.failing = false;
    t.clock.set('2026-03-30T09:06:00Z');
    await t.services.reminders.sweep();
    const done = await rows();
    expect(done.every((r) => r.status === 'sent' && r.sent_at !== null)).toBe(true);
    const ours = (await Promise.all(t.mails().map(parseEml))).filter((m) => m.subject.includes(scope.title));
    expect(ours.map((m) => m.to).sort()).toEqual([DEMO.manager, tech.email].sort());
    await t.services.reminders.sweep();
    expect((await Promise.all(t.mails().map(parseEml))).filter((m) => m.subject.includes(scope.title)).length, 'sent once').toBe(2);
  });

  it('when it lapses, then the holder and the site manager each get one notice saying what lapsed and what to do', async () => {
    t.clock.set('2026-04-01T09:00:00Z');
    await makeScope(manager, { title: 'Heater regulator bench work', reminderOffsetsDays: [], validityMonths: 1 });
    const tech = await newPerson(app());
    await verifyCertificate(manager, await submitCertificate(tech, { issuedOn: '2026-03-05', expiresOn: '2029-01-05' }), DEMO_PASSWORD);
    t.clock.set('2026-05-03T09:00:00Z');
    await t.services.reminders.sweep();
    await t.services.reminders.sweep();
    const notices = (await Promise.all(t.mails().map(parseEml))).filter((m) => m.subject.includes('Heater regulator bench work'));
    expect(notices.map((m) => m.to).sort()).toEqual([DEMO.manager, tech.email].sort());
    const own = notices.find((m) => m.to === tech.email)!;
    expect(own.subject).toBe('Lapsed: your authorisation “Heater regulator bench work”');
    expect(own.text).toMatch(/lapsed at the end of 1 May 2026\.\nIt reached the end of its validity\./);
    expect(own.text).toMatch(/To get it back:\n {2}- Meet the requirements again/);
  });

  it('when the queued sweep runs, then the procedure reviews falling due are reminded too (the demo has an overdue one), once each', async () => {
    t.transport.failing = false;
    const count = async () => Number((await t.ownerQuery('select count(*) from procedure_review_reminders where sent_at is not null')).rows[0].count);
    const first = await manager.post('/api/reminders/sweep');
    await t.waitForJobs([first.body.jobId]);
    const after = await count();
    // Only queued sweeps run the review reminders in this file (direct sweeps above do not).
    expect(after).toBeGreaterThan(0);
    const second = await manager.post('/api/reminders/sweep');
    await t.waitForJobs([second.body.jobId]);
    expect(await count(), 'sent once').toBe(after);
  });
});
