import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { ensureDatabase, findPostgresBin, initCluster, isRunning, resolveDataDir, startCluster, stopCluster } from './cluster.js';
import { isPortFree, portOrFree } from './ports.js';

export interface LocalDb {
  url: string;
  stop: () => void;
  where: string;
}

const DEFAULT_PG_PORT = 54329;

/** DATABASE_URL when set; otherwise the project's own cluster under .data/ (or where postgres can reach). */
export async function localDatabase(root: string, dataRoot: string, log: (s: string) => void): Promise<LocalDb> {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, stop: () => undefined, where: 'DATABASE_URL' };
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
  return { url: `postgres://postgres@127.0.0.1:${port}/breakover`, stop: () => stopCluster(bin, dir), where: `${dir} (port ${port})` };
}

export function persistentSecret(dataRoot: string): string {
  const file = path.join(dataRoot, 'session-secret');
  mkdirSync(dataRoot, { recursive: true });
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}
