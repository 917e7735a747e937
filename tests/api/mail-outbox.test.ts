import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { deliverMail } from '../support/deliver.js';
import { startSmtpPeer } from '../support/smtp.js';
import { nextDraft, publishNew, submitAndApprove } from '../support/procedures.js';

let t: TestApp;
let peer: Awaited<ReturnType<typeof startSmtpPeer>>;
type Agent = Awaited<ReturnType<typeof signIn>>;
let admin: Agent, manager: Agent, manager2: Agent, tech: Agent, tech3: Agent;

beforeAll(async () => {
  peer = await startSmtpPeer();
  // Delivery runs right after each commit that wrote mail, as the queue does in a running server.
  t = await makeTestApp({ env: { SMTP_URL: peer.url } });
  [admin, manager, manager2, tech, tech3] = await Promise.all([DEMO.admin, DEMO.manager, DEMO.manager2, DEMO.technician, DEMO.technician3].map((e) => signIn(t, e)));
});

const arrived = (subject: string) => peer.received.filter((m) => m.subject.includes(subject));

describe('re-read notices', () => {
  it('when the mail server refuses the notices of a new version, then they wait with their error and are delivered once on the next attempt', async () => {
    const d = await publishNew(manager, manager2);
    for (const a of [tech, tech3]) expect((await a.post(`/api/procedures/${d.id}/versions/${d.versionId}/acknowledge`).send({ password: DEMO_PASSWORD })).status).toBe(201);
    const v2 = await nextDraft(manager, d.id, () => ({ changeClass: 're-read', changeSummary: 'The isolation step names the lock-off point.' }));
    peer.state.refuse = 2;
    await submitAndApprove(manager, manager2, d.id, v2.id);
    const waiting = (await admin.get('/api/mail').query({ status: 'waiting' })).body.items.filter((m: { subject: string }) => m.subject.includes(d.code));
    expect(waiting.map((m: { toAddress: string }) => m.toAddress).sort()).toEqual([DEMO.technician, DEMO.technician3].sort());
    expect(waiting.every((m: { attempts: number; error: string }) => m.attempts === 1 && /451/.test(m.error))).toBe(true);
    expect(arrived(d.code)).toEqual([]);

    t.clock.advance(60_000);
    await deliverMail(t);
    await deliverMail(t);
    expect(arrived(d.code).map((m) => m.to[0]).sort()).toEqual([DEMO.technician, DEMO.technician3].sort());
  });
});

describe('the outbox page', () => {
  it('when the mail server refuses a message for good, then it is failed at once, the admin sees why and can send it again, once, in the trail', async () => {
    peer.state.refuse = 1;
    peer.state.code = 550;
    expect((await t.request().post('/api/password/forgot').send({ email: DEMO.technician2 })).status).toBe(202);
    peer.state.code = 451;
    const page = (await admin.get('/api/mail').query({ status: 'failed' })).body;
    expect(page.counts.failed).toBe(1);
    const [failed] = page.items;
    expect(failed).toMatchObject({ toAddress: DEMO.technician2, subject: 'Reset your Breakover password', kind: 'reset', status: 'failed', attempts: 1 });
    expect(failed.error).toMatch(/550 mailbox unavailable/);
    expect(arrived('Reset your Breakover password')).toEqual([]);

    expect((await manager.post(`/api/mail/${failed.id}/retry`)).status, 'a manager does not run the outbox').toBe(403);
    const retried = await admin.post(`/api/mail/${failed.id}/retry`);
    expect(retried.status, JSON.stringify(retried.body)).toBe(200);
    expect(retried.body).toMatchObject({ status: 'waiting', attempts: 0 });
    expect(arrived('Reset your Breakover password').map((m) => m.to)).toEqual([[DEMO.technician2]]);
    const opened = (await admin.get(`/api/mail/${failed.id}`)).body;
    expect(opened).toMatchObject({ status: 'sent', attempts: 1, raw: null });
    expect(opened.text).toContain('/set-password?token=');

    const again = await admin.post(`/api/mail/${failed.id}/retry`);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/only a failed message can be retried/);
    const trail = await t.ownerQuery(`select actor_id, old_values from audit_log where action = 'mail.retried' and entity_id = $1`, [failed.id]);
    expect(trail.rows).toHaveLength(1);
    expect(trail.rows[0].old_values).toMatchObject({ status: 'failed', attempts: 1 });
  });
});
