import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import request from 'supertest';
import { makeTestApp, PUBLIC_URL, type TestApp } from '../support/app.js';
import { DEMO } from '../support/people.js';

// Two real server processes (node, each its own pool and memory) on one database.
const LIMIT = 30;
let t: TestApp;
const children: ChildProcess[] = [];
const urls: string[] = [];

async function startServer(): Promise<string> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.resolve('tests/support/signin-server.ts')], {
    env: {
      ...process.env, DATABASE_URL: t.database.url, PUBLIC_URL, SESSION_SECRET: t.config.sessionSecret, MAIL_OUTBOX_DIR: t.outbox,
      SIGNIN_RATE_LIMIT: String(LIMIT), STATIC_DIR: t.config.staticDir, SERVER_CLOCK: t.clock.now().toISOString(),
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  children.push(child);
  const port = await new Promise<string>((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => {
      const m = d.toString().match(/listening (\d+)/);
      if (m) resolve(m[1]);
    });
    child.once('exit', (code) => reject(new Error(`server process exited with ${code}`)));
  });
  return `http://127.0.0.1:${port}`;
}

beforeAll(async () => {
  t = await makeTestApp({ env: { SIGNIN_RATE_LIMIT: String(LIMIT) } });
  urls.push(...(await Promise.all([startServer(), startServer()])));
}, 60_000);
afterAll(async () => {
  for (const c of children.splice(0)) {
    if (c.exitCode !== null) continue;
    c.kill('SIGTERM');
    await new Promise((r) => c.once('exit', r));
  }
});

describe('the sign-in rate limit across server processes', () => {
  it('when sign-in attempts alternate between two node processes, then the one over the limit is refused with 429', async () => {
    // Spread over the demo people so that none reaches the account lock (at most four guesses each).
    const people = Object.values(DEMO);
    const guess = (i: number) => request(urls[i % 2]).post('/api/session').set('Origin', PUBLIC_URL).send({ email: people[i % people.length], password: 'a guess at a password' });
    for (let i = 0; i < LIMIT; i++) expect((await guess(i)).body.error.code).toBe('bad_credentials');
    const over = await guess(LIMIT);
    expect(over.status).toBe(429);
    expect(over.body.error.message).toBe('Too many attempts from this address; wait 5 minute(s) and try again.');
    expect((await guess(LIMIT + 1)).status).toBe(429);
  });
});
