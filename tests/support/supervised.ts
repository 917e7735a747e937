// `npm start` as a user runs it, in a data folder of its own, and the processes it looks after.
import { execFile, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import { findPostgresBin } from '../../scripts/lib/cluster.js';

/** The process ids below `pid` whose command line contains `needle` (from /proc). */
export function descendants(pid: number, needle: string): number[] {
  const parentOf = new Map<number, number>();
  for (const entry of readdirSync('/proc').filter((e) => /^\d+$/.test(e))) {
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
      parentOf.set(Number(entry), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
    } catch {
      /* gone meanwhile */
    }
  }
  const below = (p: number): boolean => {
    for (let q = parentOf.get(p); q !== undefined && q > 1; q = parentOf.get(q)) if (q === pid) return true;
    return false;
  };
  return [...parentOf.keys()].filter((p) => {
    if (!below(p)) return false;
    try {
      return readFileSync(`/proc/${p}/cmdline`, 'utf8').includes(needle);
    } catch {
      return false;
    }
  });
}

/** The pid of the node server that npm start runs (exactly one is expected). */
export function serverPid(npmStart: ChildProcess): number {
  const found = descendants(npmStart.pid!, 'server/index.ts');
  if (found.length !== 1) throw new Error(`expected one server process below npm start, found ${found.length}`);
  return found[0];
}

export const postmasterPid = (pgDir: string) => Number(readFileSync(path.join(pgDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
export const clusterStopped = (pgDir: string) => !existsSync(path.join(pgDir, 'postmaster.pid'));

/** `pg_ctl <args>` on the cluster as the postgres user (when we are root), without blocking this process. */
export async function pgCtl(pgDir: string, args: string[]): Promise<void> {
  const exe = path.join(findPostgresBin(() => undefined), 'pg_ctl');
  const full = ['-D', pgDir, '-l', path.join(pgDir, 'server.log'), ...args];
  if (process.getuid?.() === 0) await promisify(execFile)('runuser', ['-u', 'postgres', '--', exe, ...full]);
  else await promisify(execFile)(exe, full);
}
