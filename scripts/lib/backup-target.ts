// Where backup and restore work: the private cluster (started for the job when it is not running, and
// stopped again after) or the database DATABASE_OWNER_URL names. Both always connect as the owner.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { findPostgresBin, isRunning, resolveDataDir } from './cluster.js';
import { externalDatabase, localDatabase } from './local-db.js';

export interface BackupTarget {
  /** The owner's login to the database itself. */
  ownerUrl: string;
  /** The database's name and the owner's login to the server's maintenance database (to drop and create it). */
  name: string;
  maintenanceUrl: string;
  /** Folder of Debian's PostgreSQL binaries (pg_dump, pg_restore). */
  bin: string;
  /** Stops the private cluster when this command started it; nothing otherwise. */
  release: () => void;
  where: string;
}

export async function openTarget(root: string, dataRoot: string, log: (s: string) => void, mayCreate: boolean): Promise<BackupTarget> {
  const bin = findPostgresBin(log);
  if (process.env.DATABASE_URL || process.env.DATABASE_OWNER_URL) {
    const { ownerUrl } = externalDatabase(process.env);
    return { ...names(ownerUrl), ownerUrl, bin, release: () => undefined, where: 'the database of DATABASE_OWNER_URL' };
  }
  const { dir } = resolveDataDir(dataRoot, root);
  if (!mayCreate && !existsSync(path.join(dir, 'PG_VERSION'))) {
    throw new Error(`there is no database cluster in ${dir}: nothing to back up (is BREAKOVER_DATA_DIR right?)`);
  }
  const wasRunning = isRunning(dir);
  const db = await localDatabase(root, dataRoot, log);
  if (!wasRunning) log(`started the private cluster for this (${db.where}); it is stopped again when done`);
  return { ...names(db.ownerUrl), ownerUrl: db.ownerUrl, bin, release: wasRunning ? () => undefined : db.stop, where: `the private cluster in ${db.where}` };
}

function names(ownerUrl: string): { name: string; maintenanceUrl: string } {
  const u = new URL(ownerUrl);
  const name = decodeURIComponent(u.pathname.replace(/^\//, ''));
  if (!name) throw new Error('DATABASE_OWNER_URL names no database');
  u.pathname = '/postgres';
  return { name, maintenanceUrl: u.toString() };
}

/** The folders of the installation: data (cluster, keys, anchors), anchors, and the mail outbox. */
export function installationDirs(root: string) {
  const dataRoot = path.resolve(process.env.BREAKOVER_DATA_DIR ?? path.join(root, '.data'));
  return {
    dataRoot,
    anchorDir: path.resolve(process.env.AUDIT_ANCHOR_DIR ?? dataRoot),
    outboxDir: path.resolve(process.env.MAIL_OUTBOX_DIR ?? path.join(root, 'mail-outbox')),
  };
}
