import { describe, it, expect, afterAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { makeTestApp, TEST_AUDIT_KEY } from '../support/app.js';
import { seal } from '../support/audit.js';
import { runCommand } from '../support/installation.js';
import { databaseEnv, onAdmin, query, urlOf } from '../support/backup-db.js';

// The audit key lives outside the database: a restore verifies the chain with the installation's key,
// and takes the key from the backup only when it was put there on purpose.
const t = await makeTestApp();
const work = mkdtempSync(path.join(os.tmpdir(), 'breakover-backup-key-'));
const suffix = randomBytes(4).toString('hex');
const targets = [`bk_key_${suffix}`, `bk_wrong_${suffix}`];
const source = { DATABASE_URL: t.database.url, DATABASE_OWNER_URL: t.database.ownerUrl, AUDIT_ANCHOR_DIR: t.config.audit.anchorDir, MAIL_OUTBOX_DIR: t.outbox };

/** A data folder of its own (holding `key` as its audit key file, when given). */
function dataFolder(name: string, key?: string): Record<string, string> {
  const dir = path.join(work, name);
  execFileSync('mkdir', ['-p', dir]);
  if (key) writeFileSync(path.join(dir, 'audit-key'), key);
  return { BREAKOVER_DATA_DIR: dir, AUDIT_ANCHOR_DIR: dir, MAIL_OUTBOX_DIR: path.join(dir, 'outbox') };
}

afterAll(async () => {
  for (const db of targets) await onAdmin(`drop database if exists ${db} with (force)`);
  rmSync(work, { recursive: true, force: true });
});

describe('backup and the audit key', () => {
  it('when the key is included on purpose, then a fresh installation gets it back and the chain verifies; a database in use is refused', async () => {
    await seal(t, { anchor: true });
    const file = path.join(work, 'with-key.tar');
    const backup = await runCommand(['backup', '--include-audit-key', '--out', file], { ...dataFolder('source', TEST_AUDIT_KEY), ...source });
    expect(backup.code, backup.out).toBe(0);
    expect(backup.out).toContain('THIS FILE HOLDS THE AUDIT KEY');
    expect((statSync(file).mode & 0o777).toString(8), 'only the owner may read a backup').toBe('600');
    expect(execFileSync('tar', ['-tf', file], { encoding: 'utf8' }).split('\n')).toEqual(expect.arrayContaining(['audit-key', 'audit-anchors.log']));

    await onAdmin(`create database ${targets[0]}`);
    const fresh = dataFolder('fresh');
    const holder = new pg.Client({ connectionString: urlOf(targets[0]) });
    await holder.connect();
    const inUse = await runCommand(['restore', file], { ...fresh, ...databaseEnv(targets[0]) });
    await holder.end();
    expect(inUse.code).toBe(1);
    expect(inUse.out).toContain('1 other session(s) are connected to the database');
    expect((await query(urlOf(targets[0]), `select count(*)::int as n from pg_tables where schemaname = 'public'`)).rows[0].n).toBe(0);

    const restore = await runCommand(['restore', file], { ...fresh, ...databaseEnv(targets[0]) });
    expect(restore.code, restore.out).toBe(0);
    expect(restore.out).toContain('restored the audit key');
    expect(restore.out).toContain('restored the audit anchors');
    expect(restore.out).toMatch(/audit chain verified with this installation's key: \d+ entries/);
    expect(readFileSync(path.join(fresh.BREAKOVER_DATA_DIR, 'audit-key'), 'utf8').trim()).toBe(TEST_AUDIT_KEY);
  }, 120_000);

  it('when the installation restoring has another audit key, then the restore says the chain does not verify', async () => {
    const file = path.join(work, 'without-key.tar');
    const backup = await runCommand(['backup', '--out', file], { ...dataFolder('source2', TEST_AUDIT_KEY), ...source });
    expect(backup.code, backup.out).toBe(0);
    expect(execFileSync('tar', ['-tf', file], { encoding: 'utf8' })).not.toContain('audit-key');
    await onAdmin(`create database ${targets[1]}`);
    const restore = await runCommand(['restore', file], { ...dataFolder('other', 'b2'.repeat(32)), ...databaseEnv(targets[1]) });
    expect(restore.code, restore.out).toBe(0);
    expect(restore.out).toContain('WARNING: the audit chain does not verify with this installation\'s key');
  }, 120_000);
});
