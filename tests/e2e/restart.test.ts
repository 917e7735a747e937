import { describe, it, expect, afterAll } from 'vitest';
import type { ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, chmodSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from '../../scripts/lib/ports.js';
import { startInstall } from '../support/installation.js';
import { DEMO_PASSWORD } from '../../server/seed/demo-people.js';

// The whole `npm start` path, as a user runs it: then SIGKILL of the server and of the database.
const dataDir = mkdtempSync(path.join(os.tmpdir(), 'breakover-restart-'));
chmodSync(dataDir, 0o755);
let child: ChildProcess | undefined;

afterAll(() => {
  if (child?.pid) {
    try {
      process.kill(-child.pid, 'SIGKILL');
    } catch {
      /* already gone */
    }
  }
  const pidFile = path.join(dataDir, 'pg', 'postmaster.pid');
  if (existsSync(pidFile)) process.kill(Number(readFileSync(pidFile, 'utf8').split('\n')[0]), 'SIGKILL');
  rmSync(dataDir, { recursive: true, force: true });
});

async function signedIn(base: string) {
  const res = await fetch(`${base}/api/session`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email: 'admin@demo.breakover.test', password: DEMO_PASSWORD }) });
  expect(res.status).toBe(200);
  return res.headers.get('set-cookie')!.split(';')[0];
}

describe('npm start survives SIGKILL', () => {
  it('when the server and the database are killed with SIGKILL, then a second start keeps every record', async () => {
    const env = { BREAKOVER_DATA_DIR: dataDir, PGPORT: String(await freePort()), PORT: String(await freePort()), SKIP_BUILD: '1' };
    const base = `http://localhost:${env.PORT}`;
    const first = await startInstall(env);
    child = first.proc;
    expect(first.output()).toContain('technician');
    const cookie = await signedIn(base);
    const created = await fetch(`${base}/api/sites`, {
      method: 'POST', headers: { 'content-type': 'application/json', cookie, origin: base },
      body: JSON.stringify({ code: 'KILL-TEST', name: 'Site made before the crash', timeZone: 'Europe/Vienna', personTerm: 'skilled person' }),
    });
    expect(created.status).toBe(201);

    const postmaster = Number(readFileSync(path.join(dataDir, 'pg', 'postmaster.pid'), 'utf8').split('\n')[0]);
    process.kill(-first.proc.pid!, 'SIGKILL');
    process.kill(postmaster, 'SIGKILL');
    await new Promise((r) => setTimeout(r, 500));

    const second = await startInstall(env);
    child = second.proc;
    expect(second.output()).not.toContain('seeded the demo scenario');
    const again = await signedIn(base);
    const sites = (await (await fetch(`${base}/api/sites`, { headers: { cookie: again } })).json()) as { code: string }[];
    expect(sites.map((s) => s.code)).toContain('KILL-TEST');

    process.kill(-second.proc.pid!, 'SIGTERM');
    await new Promise((r) => second.proc.on('exit', r));
    expect(existsSync(path.join(dataDir, 'pg', 'postmaster.pid')), 'the cluster was stopped cleanly').toBe(false);
  }, 180_000);
});
