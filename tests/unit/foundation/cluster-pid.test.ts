import { describe, it, expect, afterAll } from 'vitest';
import { spawn } from 'node:child_process';
import { copyFileSync, mkdtempSync, rmSync, writeFileSync, existsSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { isRunning } from '../../../scripts/lib/cluster.js';

// A postmaster killed with SIGKILL stays a zombie until its parent reaps it; on a machine whose
// init does not reap, its pid file then names a process that still "exists" to kill(pid, 0).
const dir = mkdtempSync(path.join(os.tmpdir(), 'breakover-pid-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function pidFile(pid: number) {
  writeFileSync(path.join(dir, 'postmaster.pid'), `${pid}\n${dir}\n0\n54329\n`);
}

async function zombieNamedPostgres(): Promise<{ pid: number; parent: () => void }> {
  const fake = path.join(dir, 'postgres');
  copyFileSync('/bin/sleep', fake);
  // The parent starts the child and never waits for it, so the killed child stays a zombie.
  const parent = spawn('python3', ['-c', `import subprocess,time,sys\np=subprocess.Popen([${JSON.stringify(fake)},'60'])\nprint(p.pid,flush=True)\ntime.sleep(60)`], { stdio: ['ignore', 'pipe', 'inherit'] });
  const pid = await new Promise<number>((resolve) => parent.stdout!.once('data', (c) => resolve(Number(String(c).trim()))));
  return { pid, parent: () => parent.kill('SIGKILL') };
}

describe('the cluster pid file', () => {
  it('when no pid file exists, then the cluster is not running', () => {
    expect(isRunning(path.join(dir, 'none'))).toBe(false);
  });

  it('when the pid file names a process of another program, then the cluster is not running', () => {
    pidFile(process.pid);
    expect(isRunning(dir)).toBe(false);
  });

  it('when the pid file names a live process called postgres, then the cluster is running; once it is a zombie, it is not', async () => {
    const z = await zombieNamedPostgres();
    try {
      pidFile(z.pid);
      expect(isRunning(dir)).toBe(true);
      process.kill(z.pid, 'SIGKILL');
      for (let i = 0; i < 50 && readFileSync(`/proc/${z.pid}/stat`, 'utf8').split(') ')[1][0] !== 'Z'; i++) {
        await new Promise((r) => setTimeout(r, 20));
      }
      expect(existsSync(`/proc/${z.pid}`), 'the zombie is still in the process table').toBe(true);
      expect(isRunning(dir)).toBe(false);
    } finally {
      z.parent();
    }
  });
});
