import { describe, it, expect, afterAll } from 'vitest';
import { execFileSync, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chmodSync, copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from '../../scripts/lib/ports.js';
import { countRows, type Member } from '../../scripts/lib/backup-manifest.js';
import { DEMO } from '../support/people.js';
import { filesOnceThere, grants, runCommand, startInstall, stopInstall, withOwner, type Env } from '../support/installation.js';
import { api, signIn, uploadCsv } from '../support/installation-api.js';

// The whole path as an operator runs it: a running installation backed up, its data folder lost, the
// audit key put back from its separate copy, the backup restored, and every record looked for.
const dataDir = mkdtempSync(path.join(os.tmpdir(), 'breakover-backup-'));
const copies = mkdtempSync(path.join(os.tmpdir(), 'breakover-copies-'));
chmodSync(dataDir, 0o755);
const file = path.join(copies, 'nightly.tar');
let server: ChildProcess | undefined;
let env: Env;
let base: string;

afterAll(async () => {
  if (server) await stopInstall(server).catch(() => undefined);
  const pidFile = path.join(dataDir, 'pg', 'postmaster.pid');
  if (existsSync(pidFile)) process.kill(Number(readFileSync(pidFile, 'utf8').split('\n')[0]), 'SIGKILL');
  rmSync(dataDir, { recursive: true, force: true });
  rmSync(copies, { recursive: true, force: true });
});

const siteCodes = (c: import('pg').Client) => c.query<{ code: string }>('select code from sites order by code').then((r) => r.rows.map((x) => x.code));

describe('backup and restore', () => {
  it('when a running installation is backed up, its data folder lost and the backup restored, then every record, evidence file and the audit chain come back', async () => {
    env = { BREAKOVER_DATA_DIR: dataDir, PGPORT: String(await freePort()), PORT: String(await freePort()), SKIP_BUILD: '1', MAIL_OUTBOX_DIR: path.join(dataDir, 'outbox') };
    base = `http://localhost:${env.PORT}`;
    server = (await startInstall(env)).proc;
    const admin = await signIn(base, DEMO.admin);
    const site = await api(base, admin, 'POST', '/api/sites', { code: 'BACKUP-TEST', name: 'Site made before the backup', timeZone: 'Europe/Vienna', personTerm: 'skilled person' });
    const bytes = Buffer.from(`instrument,reading_ohm\nMFT-1,0.42\nMFT-1,${Date.now()}\n`);
    const technician = await signIn(base, DEMO.technician);
    const evidence = await uploadCsv(base, technician, bytes, 'continuity.csv');
    await api(base, admin, 'POST', '/api/people', { email: 'kept.through.backup@demo.breakover.test', name: 'Kept Through-Backup', siteId: site.id, roles: ['technician'] });
    const invitation = await filesOnceThere(env.MAIL_OUTBOX_DIR!); // delivered by the queue after the commit
    const before = { sites: await api(base, admin, 'GET', '/api/sites'), people: await api(base, admin, 'GET', '/api/people?pageSize=100'), authorisations: await api(base, admin, 'GET', '/api/authorisations?pageSize=100') };
    expect(before.sites.map((s: { id: string }) => s.id)).toContain(site.id);

    const backup = await runCommand(['backup', '--out', file], env);
    expect(backup.code, backup.out).toBe(0);
    expect(backup.out).toContain('the audit key and the session secret are not in this file');
    expect(execFileSync('sha256sum', ['-c', `${file}.sha256`], { cwd: copies, encoding: 'utf8' })).toContain('nightly.tar: OK');
    const manifest = JSON.parse(execFileSync('tar', ['-xOf', file, 'manifest.json'], { encoding: 'utf8' }));
    const outbox = Object.fromEntries((manifest.members as Member[]).filter((m) => m.path.startsWith('mail-outbox/')).map((m) => [m.path.slice(12), m.sha256]));
    expect(outbox).toMatchObject(invitation);
    expect(manifest.includes).toMatchObject({ auditKey: false, outboxFiles: Object.keys(outbox).length });
    expect(execFileSync('tar', ['-tf', file], { encoding: 'utf8' })).not.toContain('audit-key');

    await stopInstall(server);
    const grantsBefore = await withOwner(dataDir, grants);
    copyFileSync(path.join(dataDir, 'audit-key'), path.join(copies, 'audit-key')); // the key's own, separate copy
    rmSync(dataDir, { recursive: true, force: true });
    mkdirSync(dataDir, { mode: 0o755 });
    copyFileSync(path.join(copies, 'audit-key'), path.join(dataDir, 'audit-key'));

    const restore = await runCommand(['restore', file], env);
    expect(restore.code, restore.out).toBe(0);
    expect(restore.out).toContain('audit chain verified with this installation\'s key');
    await withOwner(dataDir, async (c) => {
      expect(await countRows(c)).toEqual(manifest.tables);
      expect(await grants(c)).toEqual(grantsBefore);
      const may = await c.query(`select has_table_privilege('breakover_app', 'audit_log', 'INSERT') as ins, has_table_privilege('breakover_app', 'audit_log', 'UPDATE') as upd, has_table_privilege('breakover_app', 'audit_log', 'DELETE') as del`);
      expect(may.rows[0]).toEqual({ ins: true, upd: false, del: false });
    });

    expect(await filesOnceThere(env.MAIL_OUTBOX_DIR!)).toEqual(outbox);
    const again = await startInstall(env);
    server = again.proc;
    expect(again.output()).not.toContain('seeded the demo scenario');
    const admin2 = await signIn(base, DEMO.admin);
    expect(await api(base, admin2, 'GET', '/api/sites')).toEqual(before.sites);
    expect(await api(base, admin2, 'GET', '/api/people?pageSize=100')).toEqual(before.people);
    expect(await api(base, admin2, 'GET', '/api/authorisations?pageSize=100')).toEqual(before.authorisations);
    const content = await fetch(`${base}/api/evidence/${evidence.id}/content`, { headers: { cookie: admin2 } });
    const sha = createHash('sha256').update(Buffer.from(await content.arrayBuffer())).digest('hex');
    expect(sha).toBe(createHash('sha256').update(bytes).digest('hex'));
    const auditor = await signIn(base, DEMO.auditor);
    const chain = await api(base, auditor, 'POST', '/api/audit/verify');
    expect(chain.issues).toEqual([]);
    expect(chain.intact).toBe(true);
    expect(chain.entries).toBeGreaterThanOrEqual(manifest.tables['public.audit_log']);
    // A record made after the restore: the app's role writes as before.
    await api(base, admin2, 'POST', '/api/sites', { code: 'AFTER-RESTORE', name: 'Site made after the restore', timeZone: 'Europe/Vienna', personTerm: 'skilled person' });
    await stopInstall(server);
  }, 300_000);

  it('when the backup file is corrupted or the database is not empty, then restore refuses and changes nothing', async () => {
    const flipped = path.join(copies, 'flipped.tar');
    copyFileSync(file, flipped);
    copyFileSync(`${file}.sha256`, `${flipped}.sha256`);
    const bytes = readFileSync(flipped);
    bytes[Math.floor(bytes.length / 2)] ^= 0xff;
    writeFileSync(flipped, bytes);
    const corrupted = await runCommand(['restore', flipped], env);
    expect(corrupted.code).toBe(1);
    expect(corrupted.out).toMatch(/flipped\.tar is corrupted: its SHA-256 is [0-9a-f]{64}, but flipped\.tar\.sha256 says/);

    // The dump changed inside and the outer checksum made again: the manifest's own hash still catches it.
    const unpacked = mkdtempSync(path.join(copies, 'unpacked-'));
    execFileSync('tar', ['-xf', file, '-C', unpacked]);
    const dump = readFileSync(path.join(unpacked, 'database.dump'));
    dump[dump.length - 10] ^= 0xff;
    writeFileSync(path.join(unpacked, 'database.dump'), dump);
    const repacked = path.join(copies, 'repacked.tar');
    execFileSync('tar', ['-cf', repacked, '-C', unpacked, 'manifest.json', 'database.dump']);
    writeFileSync(`${repacked}.sha256`, `${createHash('sha256').update(readFileSync(repacked)).digest('hex')}  repacked.tar\n`);
    const tampered = await runCommand(['restore', repacked], env);
    expect(tampered.code).toBe(1);
    expect(tampered.out).toContain('database.dump in');
    expect(tampered.out).toContain('is corrupted');

    const notEmpty = await runCommand(['restore', file], env);
    expect(notEmpty.code).toBe(1);
    expect(notEmpty.out).toContain('is not empty');
    expect(notEmpty.out).toContain('nothing was changed');
    expect(await withOwner(dataDir, siteCodes)).toContain('AFTER-RESTORE');
  }, 120_000);

  it('when restore is given --force, then it drops the database and puts the backup in its place', async () => {
    const forced = await runCommand(['restore', '--force', file], env);
    expect(forced.code, forced.out).toBe(0);
    expect(forced.out).toContain('--force: DROPPING database "breakover"');
    const codes = await withOwner(dataDir, siteCodes);
    expect(codes).toContain('BACKUP-TEST');
    expect(codes).not.toContain('AFTER-RESTORE');
  }, 120_000);

  it('when nothing is running, then backup starts the private cluster and stops it again after', async () => {
    const offline = path.join(copies, 'offline.tar');
    const backup = await runCommand(['backup', '--out', offline], env);
    expect(backup.code, backup.out).toBe(0);
    expect(backup.out).toContain('started the private cluster for this');
    expect(existsSync(path.join(dataDir, 'pg', 'postmaster.pid')), 'the cluster was stopped again').toBe(false);
    const manifest = JSON.parse(execFileSync('tar', ['-xOf', offline, 'manifest.json'], { encoding: 'utf8' }));
    expect(manifest.tables['public.sites']).toBe(3);
  }, 120_000);
});
