import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { Writable } from 'node:stream';
import { makeTestApp, type TestApp } from '../support/app.js';
import { tcpProxy } from '../support/tcp-proxy.js';
import { DEMO } from '../support/people.js';
import { DEMO_PASSWORD } from '../../server/seed/demo-people.js';
import { createLogger } from '../../server/logging.js';
import { createPool } from '../../server/db/client.js';

// The app reaches its database through a proxy the test can cut: every pooled connection is dropped at
// once, as when PostgreSQL restarts. An 'error' from an idle pooled connection left unheard would end this
// very process (the test worker), so the test passing at all says the pools listen.
const admin = new URL(process.env.TEST_PG_ADMIN_URL!);
const proxy = await tcpProxy({ host: admin.hostname, port: Number(admin.port) });
let t: TestApp;
let cookie: string;

beforeAll(async () => {
  t = await makeTestApp({ databaseUrl: (url) => proxy.via(url) });
  const res = await t.request().post('/api/session').send({ email: DEMO.manager, password: DEMO_PASSWORD });
  cookie = res.headers['set-cookie'][0].split(';')[0];
  // Several idle connections in the pool, so the cut drops more than one.
  await Promise.all([1, 2, 3, 4].map(() => t.request().get('/api/sites').set('Cookie', cookie)));
});
afterAll(async () => {
  await proxy.restore();
});

describe('the app while its database goes away', () => {
  it('when every database connection drops and new ones are refused, then requests get 503 with Retry-After, and once it is back the same session works', async () => {
    await proxy.cut();
    // Bounded wait until the pool has heard of every dropped connection.
    for (let i = 0; i < 100 && t.deps.pool.totalCount > 0; i++) await new Promise((r) => setTimeout(r, 50));
    expect(t.deps.pool.totalCount).toBe(0);
    for (const path of ['/api/session', '/api/sites']) {
      const res = await t.request().get(path).set('Cookie', cookie);
      expect(res.status, path).toBe(503);
      expect(res.headers['retry-after']).toBe('5');
      expect(res.body.error.code).toBe('database_unavailable');
    }
    expect((await t.request().get('/api/health')).status).toBe(503);

    await proxy.restore();
    const session = await t.request().get('/api/session').set('Cookie', cookie);
    expect(session.status).toBe(200);
    expect(session.body.email).toBe(DEMO.manager);
    expect((await t.request().get('/api/health')).body).toEqual({ status: 'ok', database: 'up' });
  });
});

describe('what the pool logs', () => {
  it('when every connection of a pool drops at once, then one warning is logged, and one line when a connection is made again', async () => {
    const lines: string[] = [];
    const sink = new Writable({ write: (chunk, _enc, done) => (lines.push(String(chunk)), done()) });
    const pool = createPool(proxy.via(t.database.url), 4, createLogger({ level: 'info', format: 'json' }, sink));
    const clients = await Promise.all([1, 2, 3, 4].map(() => pool.connect()));
    clients.forEach((c) => c.release());
    expect(pool.idleCount).toBe(4);
    await proxy.cut();
    for (let i = 0; i < 100 && pool.totalCount > 0; i++) await new Promise((r) => setTimeout(r, 50));
    expect(lines.filter((l) => l.includes('database connection lost'))).toHaveLength(1);
    await proxy.restore();
    expect((await pool.query('select 1 as one')).rows).toEqual([{ one: 1 }]);
    expect(lines.filter((l) => l.includes('database connection back'))).toHaveLength(1);
    await pool.end();
  });
});
