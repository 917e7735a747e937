// The database side of a restore: is the target empty and unused, drop and recreate it (--force),
// the application's role, pg_restore of the dump, and the default privileges of the restoring owner.
import { spawnSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { run } from './backup-dump.js';

async function withClient<T>(url: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** Sessions of others on the database: a restore under a running server would pull the floor from under it. */
export const otherSessions = (ownerUrl: string) =>
  withClient(ownerUrl, async (c) =>
    Number((await c.query<{ n: string }>('select count(*)::text as n from pg_stat_activity where datname = current_database() and pid <> pg_backend_pid()')).rows[0].n));

/** The tables already in the database (outside PostgreSQL's own schemas); none means empty. */
export const existingTables = (ownerUrl: string) =>
  withClient(ownerUrl, async (c) =>
    Number((await c.query<{ n: string }>(
      `select count(*)::text as n from pg_class c join pg_namespace n on n.oid = c.relnamespace
        where c.relkind in ('r', 'p', 'v', 'm', 'S') and n.nspname not in ('pg_catalog', 'information_schema') and n.nspname not like 'pg\\_%'`,
    )).rows[0].n));

export async function dropAndRecreate(maintenanceUrl: string, name: string): Promise<void> {
  const ident = `"${name.replace(/"/g, '""')}"`;
  await withClient(maintenanceUrl, async (c) => {
    await c.query(`drop database ${ident} with (force)`);
    await c.query(`create database ${ident}`);
  });
}

/**
 * Roles belong to the cluster, not the dump: a fresh cluster gets breakover_app as the migrations make it
 * (a login with no other rights), so the grants kept in the dump have their grantee.
 */
export const ensureAppRole = (ownerUrl: string) =>
  withClient(ownerUrl, async (c) => {
    const { rowCount } = await c.query(`select 1 from pg_roles where rolname = 'breakover_app'`);
    if (!rowCount) await c.query('create role breakover_app login noinherit');
    return !rowCount;
  });

/**
 * pg_restore in one transaction (all or nothing), owned by whoever restores. The dump's default privileges
 * name the old owner, who may not exist here: they are left out and set again for the restoring owner.
 */
export async function restoreDump(bin: string, ownerUrl: string, dump: string): Promise<void> {
  const listed = spawnSync(path.join(bin, 'pg_restore'), ['--list', dump], { encoding: 'utf8' });
  if (listed.status !== 0) throw new Error(`pg_restore --list failed: ${listed.stderr.trim()}`);
  const list = `${dump}.list`;
  writeFileSync(list, listed.stdout.split('\n').filter((l) => !/ DEFAULT ACL /.test(l)).join('\n'));
  await run(path.join(bin, 'pg_restore'), ['--no-owner', '--exit-on-error', '--single-transaction', `--use-list=${list}`, `--dbname=${ownerUrl}`, dump]);
  await withClient(ownerUrl, (c) =>
    c.query(`alter default privileges in schema public grant select, insert, update, delete on tables to breakover_app;
      alter default privileges in schema public grant usage, select on sequences to breakover_app`));
}

export { withClient };
