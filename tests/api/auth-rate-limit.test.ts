import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import request from 'supertest';
import { makeTestApp, PUBLIC_URL, type TestApp } from '../support/app.js';
import { createApp } from '../../server/app.js';
import { PgRateLimitStore } from '../../server/auth/rate-limit.store.js';
import { DEMO, DEMO_PASSWORD, signIn } from '../support/people.js';

// Two server processes on one database: two apps, each with its own pool, share the database only.
const LIMIT = 30;
let t: TestApp;
let second: ReturnType<typeof createApp>;
let benchId: string;

beforeAll(async () => {
  t = await makeTestApp({ env: { SIGNIN_RATE_LIMIT: String(LIMIT) } });
  second = createApp({ config: t.config, clock: t.clock });
  const manager = await signIn(t, DEMO.manager);
  benchId = (await manager.get('/api/benches').query({ pageSize: 100 })).body.items.find((b: { code: string }) => b.code === 'LEJ-B1').id;
});
afterAll(async () => {
  await second.close();
});

const apps = () => [t.app, second.app];
// Wrong guesses spread over the eight demo people: at most four each in a window, so none is locked
// (an unknown address would do too, but is compared with a full-cost hash and makes the test slow).
const people = Object.values(DEMO);
const guess = (i: number, from?: string) => {
  const req = request(apps()[i % 2]).post('/api/session').set('Origin', PUBLIC_URL);
  if (from) req.set('X-Forwarded-For', from);
  return req.send({ email: people[i % people.length], password: 'a guess at a password' });
};
const nextWindow = () => t.clock.advance(t.config.signIn.rateWindowMs + 1000);

describe('the sign-in rate limit is kept in the database', () => {
  it('when sign-in attempts alternate between two server processes, then the one over the limit is refused with 429', async () => {
    nextWindow();
    for (let i = 0; i < LIMIT; i++) expect((await guess(i)).body.error.code).toBe('bad_credentials');
    const over = await guess(LIMIT);
    expect(over.status).toBe(429);
    expect(over.body.error).toEqual({ code: 'rate_limited', message: 'Too many attempts from this address; wait 5 minute(s) and try again.', requestId: over.headers['x-request-id'] });
    expect((await guess(LIMIT + 1)).status).toBe(429);
    // Another address has its own count.
    expect((await guess(6, '203.0.113.7')).status).toBe(401);
    // The forgotten-password form counts against the same limit.
    expect((await request(second.app).post('/api/password/forgot').set('Origin', PUBLIC_URL).send({ email: DEMO.technician })).status).toBe(429);
    nextWindow();
    expect((await guess(7)).status).toBe(401);
  });

  it('when signatures fail, then they count towards the same limit as sign-in, and the refusal is beside the password field', async () => {
    nextWindow();
    const agents = [request.agent(t.app).set('Origin', PUBLIC_URL), request.agent(second.app).set('Origin', PUBLIC_URL)];
    for (const a of agents) expect((await a.post('/api/session').send({ email: DEMO.technician, password: DEMO_PASSWORD })).status).toBe(200);
    // Two sign-ins, then wrong signatures on both processes (the account locks after a few; those refusals count too).
    for (let i = 2; i < LIMIT; i++) {
      const res = await agents[i % 2].post(`/api/benches/${benchId}/pre-use-checks`).send({ passed: true, password: `wrong ${i}` });
      expect([401, 422]).toContain(res.status);
    }
    const over = await agents[0].post(`/api/benches/${benchId}/pre-use-checks`).send({ passed: true, password: 'wrong again' });
    expect(over.status).toBe(429);
    expect(over.body.error.fields).toEqual({ password: 'too many password attempts from this address; wait 5 minute(s) and try again' });
    expect((await guess(1)).status).toBe(429);
    t.clock.advance(t.config.signIn.lockoutMs);
  });

  it('when two processes count the same address at the same moment, then every hit is counted exactly once', async () => {
    const stores = [new PgRateLimitStore(t.deps.db, t.clock, 'race:'), new PgRateLimitStore(second.deps.db, t.clock, 'race:')];
    for (const s of stores) s.init({ windowMs: t.config.signIn.rateWindowMs } as Parameters<PgRateLimitStore['init']>[0]);
    const hits = await Promise.all(Array.from({ length: 40 }, (_, i) => stores[i % 2].increment('192.0.2.1')));
    expect(hits.map((h) => h.totalHits).sort((a, b) => a - b)).toEqual(Array.from({ length: 40 }, (_, i) => i + 1));
    await stores[0].resetKey('192.0.2.1');
  });

  it('when a window has ended, then its row is pruned on a later attempt', async () => {
    await t.ownerQuery(`insert into signin_rate_limit (key, hits, reset_at) values ('ip:198.51.100.4', 3, $1)`, [t.clock.now()]);
    nextWindow();
    expect((await guess(0)).status).toBe(401);
    const keys = (await t.ownerQuery('select key, hits from signin_rate_limit')).rows;
    expect(keys).toEqual([{ key: expect.stringMatching(/^ip:.*127\.0\.0\.1$/), hits: 1 }]);
  });
});
