import { describe, it, expect, afterAll } from 'vitest';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { runCommand } from '../support/installation.js';
import { databaseEnv, onAdmin, query, urlOf } from '../support/backup-db.js';

// A backup made by an older version (its database stopped at an earlier migration), restored by this
// one into an existing database given by DATABASE_OWNER_URL: the restore brings it up to date.
const work = mkdtempSync(path.join(os.tmpdir(), 'breakover-upgrade-'));
const suffix = randomBytes(4).toString('hex');
const [oldDb, newDb] = [`bk_old_${suffix}`, `bk_new_${suffix}`];
const journal = JSON.parse(readFileSync('drizzle/meta/_journal.json', 'utf8')) as { entries: { tag: string }[] };
const OLD_TAG = '0024_mail_outbox';

afterAll(async () => {
  for (const db of [oldDb, newDb]) await onAdmin(`drop database if exists ${db} with (force)`);
  rmSync(work, { recursive: true, force: true });
});

describe('restore of an older backup', () => {
  it('when a backup from an earlier schema is restored, then its rows come back and the migrations since are applied', async () => {
    // The migrations as an older version shipped them: the journal cut after OLD_TAG.
    const folder = path.join(work, 'drizzle');
    cpSync('drizzle', folder, { recursive: true });
    const cut = journal.entries.findIndex((e) => e.tag === OLD_TAG) + 1;
    expect(cut).toBeGreaterThan(0);
    writeFileSync(path.join(folder, 'meta', '_journal.json'), JSON.stringify({ ...journal, entries: journal.entries.slice(0, cut) }));
    await onAdmin(`create database ${oldDb}`);
    const pool = new pg.Pool({ connectionString: urlOf(oldDb), max: 1 });
    await migrate(drizzle(pool), { migrationsFolder: folder }).finally(() => pool.end());
    await query(urlOf(oldDb), `insert into sites (code, name, time_zone, person_term, created_at) values ('OLD-SITE', 'Kept since an older version', 'Europe/Berlin', 'skilled person', now())`);

    const env = { BREAKOVER_DATA_DIR: path.join(work, 'data'), AUDIT_ANCHOR_DIR: path.join(work, 'data'), MAIL_OUTBOX_DIR: path.join(work, 'outbox') };
    const file = path.join(work, 'old.tar');
    const backup = await runCommand(['backup', '--out', file], { ...env, ...databaseEnv(oldDb), AUDIT_KEY: process.env.AUDIT_KEY });
    expect(backup.code, backup.out).toBe(0);
    expect(backup.out).toContain(`schema ${OLD_TAG}`);

    await onAdmin(`create database ${newDb}`);
    const restore = await runCommand(['restore', file], { ...env, ...databaseEnv(newDb), AUDIT_KEY: process.env.AUDIT_KEY });
    expect(restore.code, restore.out).toBe(0);
    expect(restore.out).toContain(`migrated from ${OLD_TAG} to ${journal.entries.at(-1)!.tag}`);

    const applied = await query(urlOf(newDb), 'select count(*)::int as n from drizzle.__drizzle_migrations');
    expect(applied.rows[0].n).toBe(journal.entries.length);
    const sites = await query(urlOf(newDb, 'breakover_app'), `select name from sites where code = 'OLD-SITE'`);
    expect(sites.rows).toEqual([{ name: 'Kept since an older version' }]);
    // A table the later migrations made is there, with the app's rights on it.
    const seal = await query(urlOf(newDb, 'breakover_app'), `select has_table_privilege('audit_seal', 'INSERT') as ins, has_table_privilege('audit_log', 'UPDATE') as upd`);
    expect(seal.rows[0]).toEqual({ ins: true, upd: false });
  }, 180_000);
});
