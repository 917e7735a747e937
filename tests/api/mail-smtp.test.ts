import { describe, it, expect, beforeAll } from 'vitest';
import { createApp } from '../../server/app.js';
import { makeTestApp, withOrigin, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';
import { deliverMail } from '../support/deliver.js';
import { startSmtpPeer } from '../support/smtp.js';

let t: TestApp;
let peer: Awaited<ReturnType<typeof startSmtpPeer>>;
let manager: Awaited<ReturnType<typeof signIn>>;
let cleveland: string;
let n = 0;

beforeAll(async () => {
  peer = await startSmtpPeer();
  // No delivery after commit: each test runs delivery itself, as the queue's worker would.
  t = await makeTestApp({ env: { SMTP_URL: peer.url }, deliverOnCommit: false });
  manager = await signIn(t, DEMO.manager2);
  cleveland = (await manager.get('/api/sites')).body.find((s: { code: string }) => s.code === 'CLE-L2').id;
});

const row = async (to: string) => (await t.ownerQuery(`select * from mail_log where to_address = $1`, [to])).rows;
const arrived = (to: string) => peer.received.filter((m) => m.to.includes(to));
/** Invites a new person through `agent` (this app's by default); returns their address. */
async function invite(agent: ReturnType<TestApp['agent']> = manager) {
  const email = `smtp-${++n}@example.test`;
  expect((await agent.post('/api/people').send({ email, name: `Sam Peer ${n}`, siteId: cleveland, roles: ['technician'] })).status).toBe(201);
  return email;
}
/** A second server on the same database and mail server (another process, as far as the database can tell). */
const otherInstance = () => createApp({ config: { ...t.config }, clock: t.clock });

describe('delivery to a real SMTP server', () => {
  it('when the server refuses the first attempts, then the message is retried after 1 and 2 minutes and arrives once, with three attempts counted', async () => {
    const to = await invite();
    peer.state.refuse = 2;
    expect(await deliverMail(t)).toMatchObject({ sent: 0, retrying: 1 });
    expect((await row(to))[0]).toMatchObject({ status: 'waiting', attempts: 1 });
    expect((await row(to))[0].error).toMatch(/451/);
    expect(new Date((await row(to))[0].next_attempt_at).getTime() - t.clock.now().getTime()).toBe(60_000);

    expect((await deliverMail(t)).retrying, 'not due again before its back-off').toBe(0);
    t.clock.advance(60_000);
    await deliverMail(t);
    expect((await row(to))[0]).toMatchObject({ status: 'waiting', attempts: 2 });
    t.clock.advance(60_000);
    expect((await deliverMail(t)).sent, 'the second back-off is two minutes').toBe(0);
    t.clock.advance(60_000);
    await deliverMail(t);
    await deliverMail(t);
    const [sent] = await row(to);
    expect(sent).toMatchObject({ status: 'sent', attempts: 3, error: null });
    expect(arrived(to).map((m) => m.messageId)).toEqual([sent.message_id]);
    expect(peer.state.refused).toBe(2);
  });

  it('when the server that committed an invitation stops before delivering it, then another instance delivers it, once', async () => {
    const dying = otherInstance();
    const agent = withOrigin(dying.app);
    await agent.post('/api/session').send({ email: DEMO.manager2, password: DEMO_PASSWORD });
    const to = await invite(agent);
    await dying.close();
    expect((await row(to))[0].status, 'committed, not yet sent').toBe('waiting');
    expect(arrived(to)).toEqual([]);
    await deliverMail(t);
    await deliverMail(t);
    expect(arrived(to)).toHaveLength(1);
    expect((await row(to))[0].status).toBe('sent');
  });

  it('when three instances deliver at the same moment, then each message arrives exactly once', async () => {
    const addresses = [];
    for (let i = 0; i < 12; i++) addresses.push(await invite());
    const others = [otherInstance(), otherInstance()];
    try {
      const results = await Promise.all([t, ...others].map((app) => deliverMail(app)));
      expect(results.reduce((sum, r) => sum + r.sent, 0)).toBe(12);
    } finally {
      await Promise.all(others.map((o) => o.close()));
    }
    for (const to of addresses) expect(arrived(to), to).toHaveLength(1);
  });

  it('when a sender died while sending, then after ten minutes the message is sent again with the same Message-ID', async () => {
    const to = await invite();
    // As a sender leaves it when it stops between claiming the message and recording the outcome.
    await t.ownerQuery(`update mail_log set status = 'sending', attempts = 1, claimed_at = $2 where to_address = $1`, [to, t.clock.now()]);
    expect((await deliverMail(t)).sent, 'its sender may still be at it').toBe(0);
    t.clock.advance(10 * 60_000 + 1000);
    expect((await deliverMail(t)).sent).toBe(1);
    const [sent] = await row(to);
    expect(sent).toMatchObject({ status: 'sent', attempts: 2 });
    expect(arrived(to).map((m) => m.messageId)).toEqual([sent.message_id]);
  });
});
