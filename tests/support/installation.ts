// A whole installation in its own data folder, driven as a user drives it: `node scripts/bootstrap.mjs
// <command>` (npm start, backup, restore), plus the owner's queries on its private cluster while stopped.
import { spawn, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { findPostgresBin, startCluster, stopCluster } from '../../scripts/lib/cluster.js';

export type Env = Record<string, string | undefined>;

/** The installation's own settings only: the test runner's database, audit key and anchors are not its. */
export const installEnv = (env: Env): Env => ({
  ...process.env, DATABASE_URL: '', DATABASE_OWNER_URL: '', AUDIT_KEY: undefined, AUDIT_ANCHOR_DIR: undefined, ...env,
});

export async function runCommand(args: string[], env: Env): Promise<{ code: number; out: string }> {
  const proc = spawn(process.execPath, ['scripts/bootstrap.mjs', ...args], { cwd: path.resolve('.'), env: installEnv(env), stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  proc.stdout.on('data', (c) => (out += c));
  proc.stderr.on('data', (c) => (out += c));
  const code = await new Promise<number>((resolve) => proc.on('exit', (c) => resolve(c ?? 1)));
  return { code, out };
}

export async function startInstall(env: Env): Promise<{ proc: ChildProcess; output: () => string }> {
  const proc = spawn(process.execPath, ['scripts/bootstrap.mjs', 'start'], { cwd: path.resolve('.'), env: installEnv(env), detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  proc.stdout!.on('data', (c) => (out += c));
  proc.stderr!.on('data', (c) => (out += c));
  await new Promise<void>((resolve, reject) => {
    const timer = setInterval(() => {
      if (out.includes('Breakover is running at')) {
        clearInterval(timer);
        resolve();
      }
    }, 100);
    proc.on('exit', (code) => {
      clearInterval(timer);
      reject(new Error(`npm start exited with ${code}:\n${out}`));
    });
  });
  return { proc, output: () => out };
}

export async function stopInstall(proc: ChildProcess): Promise<void> {
  if (proc.exitCode !== null) return;
  const exited = new Promise((r) => proc.on('exit', r));
  process.kill(-proc.pid!, 'SIGTERM');
  await exited;
}

/** Starts the stopped installation's cluster, runs the owner's queries on its database, stops it again. */
export async function withOwner<T>(dataDir: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const bin = findPostgresBin(() => undefined);
  const port = Number(readFileSync(path.join(dataDir, 'pg-port'), 'utf8'));
  await startCluster(bin, path.join(dataDir, 'pg'), port);
  const client = new pg.Client({ connectionString: `postgres://postgres@127.0.0.1:${port}/breakover` });
  try {
    await client.connect();
    return await fn(client);
  } finally {
    await client.end().catch(() => undefined);
    stopCluster(bin, path.join(dataDir, 'pg'));
  }
}

/** Every grant on the database's tables, sequences and schemas, and its default privileges, as text. */
export async function grants(c: pg.Client): Promise<string[]> {
  const { rows } = await c.query<{ g: string }>(
    `select n.nspname || '.' || c.relname || ' ' || coalesce(c.relacl::text, '-') as g from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where n.nspname in ('public', 'pgboss', 'drizzle') and c.relkind in ('r', 'p', 'S', 'v')
     union all select 'schema ' || nspname || ' ' || coalesce(nspacl::text, '-') from pg_namespace where nspname in ('public', 'pgboss', 'drizzle')
     union all select 'default ' || defaclobjtype::text || ' ' || defaclacl::text from pg_default_acl order by 1`,
  );
  return rows.map((r) => r.g);
}

/** The files in a folder with their SHA-256, once there is at least one (a queue writes them after a commit). */
export async function filesOnceThere(dir: string, timeoutMs = 30_000): Promise<Record<string, string>> {
  for (const until = Date.now() + timeoutMs; ; ) {
    const names = existsSync(dir) ? readdirSync(dir).sort() : [];
    if (names.length) return Object.fromEntries(names.map((n) => [n, createHash('sha256').update(readFileSync(path.join(dir, n))).digest('hex')]));
    if (Date.now() > until) throw new Error(`nothing arrived in ${dir} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}
