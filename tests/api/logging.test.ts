import { Writable } from 'node:stream';
import { describe, it, expect, beforeAll } from 'vitest';
import { makeTestApp, PUBLIC_URL, type TestApp } from '../support/app.js';
import { DEMO, DEMO_PASSWORD } from '../support/people.js';
import { createLogger } from '../../server/logging.js';

// Every line the app logs, parsed: the logger writes JSON lines to this stream.
const lines: Record<string, any>[] = [];
const sink = new Writable({
  write(chunk, _enc, done) {
    for (const l of String(chunk).split('\n').filter(Boolean)) lines.push(JSON.parse(l));
    done();
  },
});

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ logger: createLogger({ level: 'info', format: 'json' }, sink) });
});

const logged = () => JSON.stringify(lines);

describe('request and error logs', () => {
  it('when a request is refused, then its error body carries the request id that its log line and X-Request-Id carry', async () => {
    const res = await t.agent().get('/api/people/not-a-uuid');
    expect(res.status).toBe(401);
    const id = res.body.error.requestId as string;
    expect(id).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.headers['x-request-id']).toBe(id);
    const line = lines.find((l) => l.req?.id === id);
    expect(line).toMatchObject({ req: { method: 'GET', url: '/api/people/not-a-uuid' }, res: { statusCode: 401 }, level: 40 });
  });

  it('when a caller sends its own plain request id, then that id is used; a hostile one is replaced', async () => {
    const own = await t.agent().get('/api/health').set('X-Request-Id', 'proxy-req-12345678');
    expect(own.headers['x-request-id']).toBe('proxy-req-12345678');
    // A value that could forge a log line or be mistaken for another request's id is not taken.
    for (const bad of ['a b c d e f g h i', '<script>alert(1)</script>', 'x'.repeat(200), 'short']) {
      const res = await t.agent().get('/api/health').set('X-Request-Id', bad);
      expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    }
  });

  it('when someone signs in and opens a password link, then no password, cookie or link token appears in any log line', async () => {
    const agent = t.agent();
    const res = await agent.post('/api/session').set('Origin', PUBLIC_URL).send({ email: DEMO.technician, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    const cookie = String(res.headers['set-cookie']).split(';')[0].split('=')[1];
    await agent.get('/api/session');
    const token = 'secret-token-value-abcdefghijklmnop';
    await t.agent().get(`/api/password/link?token=${token}`);
    expect(lines.length).toBeGreaterThan(3);
    expect(logged()).not.toContain(DEMO_PASSWORD);
    expect(logged()).not.toContain(cookie);
    expect(logged()).not.toContain(token);
    expect(logged()).toContain('token=[hidden]');
  });
});
