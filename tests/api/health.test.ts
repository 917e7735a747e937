import { describe, it, expect, beforeAll } from 'vitest';
import net from 'node:net';
import { makeTestApp, type TestApp } from '../support/app.js';
import { freePort } from '../../scripts/lib/ports.js';
import { DEMO } from '../support/people.js';
import { DEMO_PASSWORD } from '../../server/seed/demo-people.js';

let up: TestApp;
let closed: TestApp;
let silent: TestApp;
let cookie: string;

beforeAll(async () => {
  up = await makeTestApp();
  // Nothing listens on a port that was free a moment ago: every connect is refused at once.
  closed = await makeTestApp({ seed: false, env: { DATABASE_URL: `postgres://breakover_app@127.0.0.1:${await freePort()}/breakover` } });
  // A peer that takes the connection and never says a word: only the bounds end the wait.
  const mute = net.createServer(() => undefined);
  await new Promise<void>((r) => mute.listen(0, '127.0.0.1', r));
  const port = (mute.address() as net.AddressInfo).port;
  silent = await makeTestApp({ seed: false, env: { DATABASE_URL: `postgres://breakover_app@127.0.0.1:${port}/breakover` } });
  const signedIn = await up.request().post('/api/session').send({ email: DEMO.manager, password: DEMO_PASSWORD });
  expect(signedIn.status).toBe(200);
  cookie = signedIn.headers['set-cookie'][0].split(';')[0];
});

function expectUnavailable(res: { status: number; headers: Record<string, string>; body: { error?: { code?: string; message?: string; requestId?: string } } }) {
  expect(res.status).toBe(503);
  expect(res.headers['retry-after']).toBe('5');
  expect(res.body.error?.code).toBe('database_unavailable');
  expect(res.body.error?.message).toMatch(/database is not reachable/);
  expect(res.body.error?.requestId).toBe(res.headers['x-request-id']);
}

describe('health and liveness', () => {
  it('when the database answers, then /api/health is 200 ok and /api/live is 200', async () => {
    const health = await up.request().get('/api/health');
    expect(health.status).toBe(200);
    expect(health.body).toEqual({ status: 'ok', database: 'up' });
    const live = await up.request().get('/api/live');
    expect(live.status).toBe(200);
    expect(live.body).toEqual({ status: 'live' });
  });

  it('when the database refuses connections, then /api/health is 503 degraded and /api/live still 200', async () => {
    const health = await closed.request().get('/api/health').set('Cookie', cookie);
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ status: 'degraded', database: 'down' });
    expect((await closed.request().get('/api/live').set('Cookie', cookie)).status).toBe(200);
  });

  it('when the database refuses connections, then a sign-in gets 503 database_unavailable with Retry-After', async () => {
    expectUnavailable(await closed.request().post('/api/session').send({ email: DEMO.manager, password: DEMO_PASSWORD }));
  });

  it('when the database refuses connections, then a request with a session cookie gets 503, not 401 or 500', async () => {
    expectUnavailable(await closed.request().get('/api/session').set('Cookie', cookie));
    expectUnavailable(await closed.request().get('/api/sites').set('Cookie', cookie));
    // The session itself is untouched: the same cookie still works where the database is up.
    expect((await up.request().get('/api/session').set('Cookie', cookie)).status).toBe(200);
  });

  it('when the database takes the connection but never answers, then /api/health and a request end in 503', async () => {
    const health = await silent.request().get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ status: 'degraded', database: 'down' });
    expectUnavailable(await silent.request().get('/api/session').set('Cookie', cookie));
  });
});
