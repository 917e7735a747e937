// A private PostgreSQL cluster on loopback, run from Debian's binaries. Used by start, dev and test.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { appendFileSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, chmodSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';

const isRoot = process.getuid?.() === 0;

export function findPostgresBin(log: (s: string) => void): string {
  const found = locate();
  if (found) return found;
  if (!isRoot) {
    throw new Error(
      'PostgreSQL server binaries are missing. Install them (Debian: sudo apt-get install -y postgresql) ' +
        'or set DATABASE_URL to an existing database, then run the command again.',
    );
  }
  log('PostgreSQL is not installed; installing Debian\'s postgresql package (apt-get)…');
  run('apt-get', ['update'], { quiet: true });
  run('apt-get', ['install', '-y', '--no-install-recommends', 'postgresql'], { quiet: true });
  const after = locate();
  if (!after) throw new Error('apt-get finished but no PostgreSQL binaries were found under /usr/lib/postgresql');
  return after;
}

function locate(): string | undefined {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return undefined;
  const versions = readdirSync(base).filter((v) => existsSync(path.join(base, v, 'bin', 'postgres')));
  versions.sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(base, versions[0], 'bin') : undefined;
}

function run(cmd: string, args: string[], opts: { quiet?: boolean; cwd?: string } = {}): string {
  const r = spawnSync(cmd, args, { encoding: 'utf8', cwd: opts.cwd ?? '/', env: { ...process.env, LC_ALL: 'C.UTF-8' } });
  if (r.status !== 0) {
    throw new Error(`${cmd} ${args.join(' ')} failed (${r.status}): ${(r.stderr || r.stdout || '').trim().slice(-2000)}`);
  }
  return r.stdout;
}

/** Runs a PostgreSQL binary as the postgres user when we are root (initdb and postgres refuse root). */
function pgRun(bin: string, tool: string, args: string[]): string {
  const exe = path.join(bin, tool);
  return isRoot ? run('runuser', ['-u', 'postgres', '--', exe, ...args]) : run(exe, args);
}

function postgresCanReach(dir: string): boolean {
  if (!isRoot) return true;
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]).status === 0;
}

/**
 * The cluster lives in <preferred>, unless the postgres user cannot reach it (a checkout under /root):
 * then in a persistent folder under /var/lib/breakover named after the checkout's path.
 */
export function resolveDataDir(preferredParent: string, checkoutRoot: string): { dir: string; moved: boolean } {
  mkdirSync(preferredParent, { recursive: true, mode: 0o755 });
  if (postgresCanReach(preferredParent)) return { dir: path.join(preferredParent, 'pg'), moved: false };
  const hash = createHash('sha256').update(checkoutRoot).digest('hex').slice(0, 12);
  const parent = path.join('/var/lib/breakover', hash);
  mkdirSync(parent, { recursive: true, mode: 0o755 });
  chmodSync('/var/lib/breakover', 0o755);
  return { dir: path.join(parent, 'pg'), moved: true };
}

export function initCluster(bin: string, dataDir: string): boolean {
  if (existsSync(path.join(dataDir, 'PG_VERSION'))) return false;
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  chmodSync(dataDir, 0o700);
  if (isRoot) run('chown', ['postgres:postgres', dataDir]);
  pgRun(bin, 'initdb', ['-D', dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  appendFileSync(
    path.join(dataDir, 'postgresql.conf'),
    `\n# set by Breakover\nlisten_addresses = '127.0.0.1'\nunix_socket_directories = '${dataDir}'\n` +
      `max_connections = 200\nfsync = on\n`,
  );
  return true;
}

/** The postmaster named in the pid file, when it is alive (a zombie left by SIGKILL is not). */
function livePostmaster(dataDir: string): number | undefined {
  const pidFile = path.join(dataDir, 'postmaster.pid');
  if (!existsSync(pidFile)) return undefined;
  const pid = Number(readFileSync(pidFile, 'utf8').split('\n')[0]);
  if (!Number.isInteger(pid) || pid <= 0) return undefined;
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // "pid (comm) state …": comm may hold spaces, so read around the last parenthesis.
    const comm = stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')'));
    const state = stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3);
    if (comm !== 'postgres' || state === 'Z' || state === 'X') return undefined;
    return pid;
  } catch {
    return undefined;
  }
}

export function isRunning(dataDir: string): boolean {
  return livePostmaster(dataDir) !== undefined;
}

/** A pid file left by a killed server (gone, a zombie, or a pid now used by another program) is removed. */
function clearStalePidFile(dataDir: string): void {
  const pidFile = path.join(dataDir, 'postmaster.pid');
  if (existsSync(pidFile) && !isRunning(dataDir)) rmSync(pidFile, { force: true });
}

/** Waits until the server on the port takes connections (crash recovery may take a while). */
async function waitUntilAccepting(port: number, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const client = new pg.Client({ host: '127.0.0.1', port, user: 'postgres', database: 'postgres' });
    try {
      await client.connect();
      await client.query('select 1');
      await client.end();
      return;
    } catch (err) {
      await client.end().catch(() => undefined);
      if (Date.now() > until) throw new Error(`PostgreSQL on 127.0.0.1:${port} does not take connections: ${(err as Error).message}`);
      await new Promise((r) => setTimeout(r, 250));
    }
  }
}

export async function startCluster(bin: string, dataDir: string, port: number): Promise<void> {
  if (isRunning(dataDir)) {
    const pidPort = Number(readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[3]);
    if (pidPort === port) {
      await waitUntilAccepting(port, 60_000);
      return;
    }
    stopCluster(bin, dataDir);
  }
  clearStalePidFile(dataDir);
  const logFile = path.join(dataDir, 'server.log');
  // Backends of a killed postmaster may hold its shared memory for a moment: retry briefly.
  for (let attempt = 1; ; attempt++) {
    try {
      pgRun(bin, 'pg_ctl', ['-D', dataDir, '-l', logFile, '-o', `-p ${port}`, '-w', '-t', '60', 'start']);
      break;
    } catch (err) {
      if (attempt >= 10) throw err;
      clearStalePidFile(dataDir);
      await new Promise((r) => setTimeout(r, 1000));
    }
  }
  await waitUntilAccepting(port, 60_000);
}

export function stopCluster(bin: string, dataDir: string): void {
  if (!isRunning(dataDir)) return;
  pgRun(bin, 'pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
}

export function removeCluster(dataDir: string): void {
  rmSync(dataDir, { recursive: true, force: true });
}

export async function ensureDatabase(adminUrl: string, name: string, template?: string): Promise<boolean> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const exists = await client.query('select 1 from pg_database where datname = $1', [name]);
    if (exists.rowCount) return false;
    await client.query(`create database "${name}"${template ? ` template "${template}"` : ''}`);
    return true;
  } finally {
    await client.end();
  }
}
