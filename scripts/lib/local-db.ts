import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { ensureDatabase, findPostgresBin, initCluster, isRunning, resolveDataDir, startCluster, stopCluster } from './cluster.js';
import { isPortFree, portOrFree } from './ports.js';

export interface LocalDb {
  /** The application's login (user breakover_app): the server, the seed. */
  url: string;
  /** The owner's: migrations and the job queue's set-up only. */
  ownerUrl: string;
  stop: () => void;
  where: string;
  /** The private cluster, for npm start to keep running; none for an external database. */
  cluster?: { isRunning: () => boolean; start: () => Promise<void> };
}

const DEFAULT_PG_PORT = 54329;

/** DATABASE_URL and DATABASE_OWNER_URL when set; otherwise the project's own cluster under .data/ (or where postgres can reach). */
export async function localDatabase(root: string, dataRoot: string, log: (s: string) => void): Promise<LocalDb> {
  if (process.env.DATABASE_URL || process.env.DATABASE_OWNER_URL) return externalDatabase(process.env);
  const bin = findPostgresBin(log);
  const { dir, moved } = resolveDataDir(dataRoot, root);
  if (moved) log(`the postgres user cannot enter ${dataRoot}; the database cluster lives in ${dir}`);
  if (initCluster(bin, dir)) log(`created a PostgreSQL cluster in ${dir}`);
  const portFile = path.join(dataRoot, 'pg-port');
  const stored = existsSync(portFile) ? Number(readFileSync(portFile, 'utf8')) : undefined;
  let port = Number(process.env.PGPORT ?? stored ?? DEFAULT_PG_PORT);
  const running = isRunning(dir);
  if (!running && !(await isPortFree(port))) port = await portOrFree(DEFAULT_PG_PORT);
  writeFileSync(portFile, String(port));
  await startCluster(bin, dir, port);
  const admin = `postgres://postgres@127.0.0.1:${port}/postgres`;
  await ensureDatabase(admin, 'breakover');
  // Trust on loopback (initdb --auth=trust, listening on 127.0.0.1 only): the app's login needs no password.
  return {
    url: `postgres://breakover_app@127.0.0.1:${port}/breakover`,
    ownerUrl: `postgres://postgres@127.0.0.1:${port}/breakover`,
    stop: () => stopCluster(bin, dir),
    where: `${dir} (port ${port})`,
    cluster: { isRunning: () => isRunning(dir), start: () => startCluster(bin, dir, port) },
  };
}

/** An existing database: the app's login and the owner's are two URLs, and both are needed. */
export function externalDatabase(env: Record<string, string | undefined>): LocalDb {
  const url = env.DATABASE_URL;
  const ownerUrl = env.DATABASE_OWNER_URL;
  if (!url || !ownerUrl) {
    throw new Error(
      'DATABASE_URL is where the application logs in, as its own role breakover_app; DATABASE_OWNER_URL is the ' +
        `owner's login, used only for migrations. Set both (${url ? 'DATABASE_OWNER_URL' : 'DATABASE_URL'} is missing); see the README.`,
    );
  }
  return { url, ownerUrl, stop: () => undefined, where: 'DATABASE_URL' };
}

export function persistentSecret(dataRoot: string): string {
  const file = path.join(dataRoot, 'session-secret');
  mkdirSync(dataRoot, { recursive: true });
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

/** The audit chain's key (AUDIT_KEY), made once in the data folder: outside the database, like the anchors. */
export function persistentAuditKey(dataRoot: string): string {
  const file = path.join(dataRoot, 'audit-key');
  mkdirSync(dataRoot, { recursive: true });
  // 'wx': two first starts at once keep the one key written first.
  if (!existsSync(file)) {
    try {
      writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600, flag: 'wx' });
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
    }
  }
  return readFileSync(file, 'utf8').trim();
}
