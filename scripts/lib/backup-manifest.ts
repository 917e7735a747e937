// What a backup file says about itself (manifest.json), and the facts read from the database for it.
import { createHash } from 'node:crypto';
import { createReadStream, readFileSync } from 'node:fs';
import path from 'node:path';
import type pg from 'pg';

export const BACKUP_FORMAT = 'breakover-backup';
export const BACKUP_FORMAT_VERSION = 1;

export interface Member {
  path: string;
  bytes: number;
  sha256: string;
}

export interface Manifest {
  format: typeof BACKUP_FORMAT;
  formatVersion: number;
  createdAt: string;
  /** The last migration applied to the database when it was dumped (drizzle/meta/_journal.json tag). */
  schemaVersion: string;
  postgresVersion: string;
  database: string;
  /** Rows per table ("schema.table"), counted in the very snapshot pg_dump dumped. */
  tables: Record<string, number>;
  includes: { auditKey: boolean; anchors: boolean; outboxFiles: number };
  members: Member[];
}

export async function sha256File(file: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(file)) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

interface JournalEntry {
  idx: number;
  when: number;
  tag: string;
}

export function journal(root: string): JournalEntry[] {
  return (JSON.parse(readFileSync(path.join(root, 'drizzle', 'meta', '_journal.json'), 'utf8')) as { entries: JournalEntry[] }).entries;
}

/** The tag of the last migration recorded in the database (drizzle keeps each one's `when` as created_at). */
export async function schemaVersion(client: pg.ClientBase, root: string): Promise<string> {
  const { rows } = await client.query<{ at: string | null }>('select max(created_at)::text as at from drizzle.__drizzle_migrations');
  const at = Number(rows[0]?.at);
  const entry = journal(root).find((e) => e.when === at);
  return entry?.tag ?? `unknown (migration of ${at})`;
}

/** Every table outside PostgreSQL's own schemas, with its row count, in the client's current snapshot. */
export async function countRows(client: pg.ClientBase): Promise<Record<string, number>> {
  const { rows: tables } = await client.query<{ s: string; t: string }>(
    `select n.nspname as s, c.relname as t from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where c.relkind in ('r', 'p') and n.nspname not in ('pg_catalog', 'information_schema') and n.nspname not like 'pg\\_%'
      order by 1, 2`,
  );
  const counts: Record<string, number> = {};
  for (const { s, t } of tables) {
    const ident = `"${s.replace(/"/g, '""')}"."${t.replace(/"/g, '""')}"`;
    // A partitioned table counts its partitions' rows again: count only rows stored in the table itself.
    const { rows } = await client.query<{ n: string }>(`select count(*)::text as n from only ${ident}`);
    counts[`${s}.${t}`] = Number(rows[0].n);
  }
  return counts;
}

/** Tables whose count differs between two countings, as lines a person can read. */
export function countDifferences(expected: Record<string, number>, actual: Record<string, number>): string[] {
  const names = [...new Set([...Object.keys(expected), ...Object.keys(actual)])].sort();
  return names
    .filter((n) => expected[n] !== actual[n])
    .map((n) => `${n}: ${expected[n] ?? 'absent'} in the backup, ${actual[n] ?? 'absent'} restored`);
}
