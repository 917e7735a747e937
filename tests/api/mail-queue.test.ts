import { describe, it, expect, beforeAll } from 'vitest';
import { makeJobsTestApp, type JobsTestApp } from '../support/jobs.js';
import { DEMO, DEMO_PASSWORD } from '../support/people.js';
import { parseEml } from '../support/mail.js';

let t: JobsTestApp;

beforeAll(async () => {
  t = await makeJobsTestApp();
});

/** Polls the outbox row (not a fixed sleep) until it is no longer waiting or being sent. */
async function settled(to: string, timeoutMs = 30_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const [row] = (await t.ownerQuery(`select status, attempts from mail_log where to_address = $1`, [to])).rows;
    if (row && !['waiting', 'sending'].includes(row.status)) return row;
    if (Date.now() > until) throw new Error(`mail to ${to} still ${row?.status ?? 'missing'}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('delivery by the job queue', () => {
  it('when a person is invited on a server running the queue, then the invitation is delivered by the queue with no one running delivery', async () => {
    const admin = t.agent();
    await admin.post('/api/session').send({ email: DEMO.admin, password: DEMO_PASSWORD });
    const site = (await admin.get('/api/sites')).body[0].id;
    const res = await admin.post('/api/people').send({ email: 'queued.invite@example.test', name: 'Quinn Queue', siteId: site, roles: ['technician'] });
    expect(res.status).toBe(201);
    expect(await settled('queued.invite@example.test')).toEqual({ status: 'sent', attempts: 1 });
    const mails = await Promise.all(t.mails().map(parseEml));
    expect(mails.filter((m) => m.to === 'queued.invite@example.test').map((m) => m.subject)).toEqual(['Your Breakover account']);
  });
});
