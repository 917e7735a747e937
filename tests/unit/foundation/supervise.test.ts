import { describe, it, expect } from 'vitest';
import { spawn } from 'node:child_process';
import { restartDelay, superviseProcess } from '../../../scripts/lib/supervise.js';

describe('npm start supervision', () => {
  it('when the server keeps dying, then the waits double from 1 s and stop at 30 s', () => {
    expect([0, 1, 2, 3, 4, 5, 6, 50].map(restartDelay)).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000, 30000]);
  });

  it('when a supervised process exits on its own, then it is started again; after stop(), it is not', async () => {
    const lines: string[] = [];
    let starts = 0;
    const supervisor = superviseProcess(() => {
      starts++;
      // The first run ends at once; the second stays until it is stopped.
      return spawn(process.execPath, ['-e', starts === 1 ? 'process.exit(3)' : 'setInterval(() => {}, 1000)']);
    }, (s) => lines.push(s), 'the test child');
    for (let i = 0; i < 200 && starts < 2; i++) await new Promise((r) => setTimeout(r, 50));
    expect(lines).toEqual(['the test child stopped (exit code 3); starting it again in 1 s']);
    await supervisor.stop();
    await new Promise((r) => setTimeout(r, 1500));
    expect(starts).toBe(2);
    expect(supervisor.pid).toBeUndefined();
  });
});
