import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { ChildProcess } from 'node:child_process';
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from '../../scripts/lib/ports.js';
import { DEMO_PASSWORD } from '../../server/seed/demo-people.js';
import { DEMO } from '../support/people.js';
import { clusterStopped, pgCtl, postmasterPid, serverPid } from '../support/supervised.js';
import { startInstall } from '../support/installation.js';
import { expectOnlySuccessOr503, requestLoop } from '../support/request-loop.js';

// One `npm start` for the file: its database restarted and killed under requests, then its server killed.
const dataDir = mkdtempSync(path.join(os.tmpdir(), 'breakover-resilience-'));
chmodSync(dataDir, 0o755);
const pgDir = path.join(dataDir, 'pg');
let npm: { proc: ChildProcess; output: () => string };
let base: string;
let cookie: string;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
async function signIn(email: string): Promise<Response> {
  return fetch(`${base}/api/session`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email, password: DEMO_PASSWORD }) });
}
/** Bounded wait until `check` holds. */
async function eventually(check: () => Promise<boolean>, what: string, ms = 90_000) {
  for (const until = Date.now() + ms; Date.now() < until; await sleep(250)) if (await check().catch(() => false)) return;
  throw new Error(`${what} did not happen within ${ms / 1000} s:\n${npm.output().slice(-3000)}`);
}
const sessionOk = async () => (await fetch(`${base}/api/session`, { headers: { cookie } })).status === 200;

beforeAll(async () => {
  const env = { BREAKOVER_DATA_DIR: dataDir, PGPORT: String(await freePort()), PORT: String(await freePort()), SKIP_BUILD: '1' };
  base = `http://localhost:${env.PORT}`;
  npm = await startInstall(env);
  const res = await signIn(DEMO.manager);
  expect(res.status).toBe(200);
  cookie = res.headers.get('set-cookie')!.split(';')[0];
}, 180_000);

afterAll(() => {
  try {
    process.kill(-npm.proc.pid!, 'SIGKILL');
  } catch {
    /* already gone */
  }
  if (!clusterStopped(pgDir)) process.kill(postmasterPid(pgDir), 'SIGKILL');
  rmSync(dataDir, { recursive: true, force: true });
});

describe('npm start and the server survive the database', () => {
  it('when the cluster is restarted under requests, then the server keeps running, answers 200 or 503 with Retry-After meanwhile, and 200 after', async () => {
    const server = serverPid(npm.proc);
    const load = requestLoop(base, cookie);
    await load.rounds(3);
    await pgCtl(pgDir, ['-m', 'fast', '-w', 'restart']);
    await eventually(sessionOk, 'a signed-in request after the restart');
    await load.rounds(3);
    expectOnlySuccessOr503(await load.stop());
    expect(serverPid(npm.proc), 'the same server process throughout').toBe(server);
  }, 150_000);

  it('when the postmaster is killed, then npm start starts the cluster again, requests meanwhile get 503, and the job queue works after', async () => {
    const server = serverPid(npm.proc);
    const load = requestLoop(base, cookie);
    await load.rounds(3);
    process.kill(postmasterPid(pgDir), 'SIGKILL');
    await eventually(async () => npm.output().includes('the database cluster runs again'), 'the cluster started again');
    await eventually(sessionOk, 'a signed-in request after the cluster came back');
    await load.rounds(3);
    const seen = await load.stop();
    expectOnlySuccessOr503(seen);
    expect(seen.some((s) => s.path === '/api/session' && s.status === 503), 'the outage was seen').toBe(true);
    expect(serverPid(npm.proc), 'the same server process throughout').toBe(server);
    // pg-boss reconnected by itself: a sweep asked for now is taken and finished by this server's worker.
    const asked = await fetch(`${base}/api/reminders/sweep`, { method: 'POST', headers: { cookie, origin: base } });
    expect(asked.status).toBe(202);
    const { jobId } = (await asked.json()) as { jobId: string };
    await eventually(async () => ((await (await fetch(`${base}/api/reminders/sweep/${jobId}`, { headers: { cookie } })).json()) as { state: string }).state === 'completed', 'the sweep job completed');
  }, 150_000);

  it('when the server process is killed, then npm start starts it again and every record is still there', async () => {
    const admin = (await signIn(DEMO.admin)).headers.get('set-cookie')!.split(';')[0];
    const created = await fetch(`${base}/api/sites`, {
      method: 'POST', headers: { 'content-type': 'application/json', cookie: admin, origin: base },
      body: JSON.stringify({ code: 'RESTART-1', name: 'Site made before the server died', timeZone: 'Europe/Vienna', personTerm: 'skilled person' }),
    });
    expect(created.status).toBe(201);
    const before = serverPid(npm.proc);
    process.kill(before, 'SIGKILL');
    await eventually(async () => (await signIn(DEMO.manager)).status === 200, 'the demo manager signing in again');
    expect(serverPid(npm.proc)).not.toBe(before);
    expect(npm.output()).toContain('the server stopped (SIGKILL); starting it again in 1 s');
    const manager = (await signIn(DEMO.manager)).headers.get('set-cookie')!.split(';')[0];
    const sites = (await (await fetch(`${base}/api/sites`, { headers: { cookie: manager } })).json()) as { code: string }[];
    expect(sites.map((s) => s.code)).toContain('RESTART-1');
    expect(npm.output().match(/Breakover is running at/g), 'announced once').toHaveLength(1);
  }, 150_000);

  it('when Ctrl-C arrives, then the server and the cluster stop and nothing is started again', async () => {
    const exited = new Promise<number | null>((r) => npm.proc.on('exit', r));
    process.kill(-npm.proc.pid!, 'SIGINT');
    expect(await exited).toBe(0);
    const afterStop = npm.output().slice(npm.output().indexOf('SIGINT: stopping'));
    expect(afterStop).not.toContain('starting it again');
    expect(clusterStopped(pgDir), 'the cluster was stopped cleanly').toBe(true);
  }, 60_000);
});
