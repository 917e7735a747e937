// npm run backup [-- --out FILE] [--include-audit-key]: one file holding a consistent dump of the database
// (evidence files are rows in it), the audit anchors and the mail outbox's .eml files, with a manifest,
// and FILE.sha256 beside it. Safe while npm start runs; starts and stops the private cluster otherwise.
import { copyFileSync, cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ANCHOR_FILE } from '../server/audit/anchor.js';
import { installationDirs, openTarget } from './lib/backup-target.js';
import { dumpSnapshot } from './lib/backup-dump.js';
import { membersOf, writeArchive } from './lib/backup-archive.js';
import { BACKUP_FORMAT, BACKUP_FORMAT_VERSION, type Manifest } from './lib/backup-manifest.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const log = (s: string) => console.log(`[backup] ${s}`);

function parseArgs(argv: string[]): { out?: string; withKey: boolean } {
  const out = argv.includes('--out') ? argv[argv.indexOf('--out') + 1] : undefined;
  const unknown = argv.filter((a, i) => a !== '--out' && argv[i - 1] !== '--out' && a !== '--include-audit-key');
  if (unknown.length || (argv.includes('--out') && !out)) throw new Error(`usage: npm run backup [-- --out FILE] [--include-audit-key] (not understood: ${unknown.join(' ') || '--out without a file'})`);
  return { out: out && path.resolve(out), withKey: argv.includes('--include-audit-key') };
}

async function main() {
  const args = parseArgs(process.argv.slice(2));
  const dirs = installationDirs(root);
  const createdAt = new Date();
  const out = args.out ?? path.join(dirs.dataRoot, 'backups', `breakover-${createdAt.toISOString().replace(/[:.]/g, '-')}.tar`);
  mkdirSync(path.dirname(out), { recursive: true, mode: 0o700 });
  const target = await openTarget(root, dirs.dataRoot, log, false);
  const staging = mkdtempSync(path.join(os.tmpdir(), 'breakover-backup-'));
  try {
    // Anchors first: every entry they name is then committed, sealed and inside the snapshot taken next.
    const anchors = path.join(dirs.anchorDir, ANCHOR_FILE);
    if (existsSync(anchors)) copyFileSync(anchors, path.join(staging, ANCHOR_FILE));
    log(`dumping ${target.where}…`);
    const facts = await dumpSnapshot(target.bin, target.ownerUrl, root, path.join(staging, 'database.dump'));
    // The outbox after the snapshot: every .eml a mail_log row in it names was written before that row.
    const outboxFiles = copyOutbox(dirs.outboxDir, path.join(staging, 'mail-outbox'));
    if (args.withKey) writeFileSync(path.join(staging, 'audit-key'), auditKeyOf(dirs.dataRoot), { mode: 0o600 });
    const manifest: Manifest = {
      format: BACKUP_FORMAT, formatVersion: BACKUP_FORMAT_VERSION, createdAt: createdAt.toISOString(),
      schemaVersion: facts.schemaVersion, postgresVersion: facts.postgresVersion, database: target.name, tables: facts.tables,
      includes: { auditKey: args.withKey, anchors: existsSync(path.join(staging, ANCHOR_FILE)), outboxFiles },
      members: await membersOf(staging),
    };
    const sum = await writeArchive(staging, manifest, out);
    const rows = Object.values(facts.tables).reduce((a, b) => a + b, 0);
    log(`wrote ${out} (schema ${facts.schemaVersion}, ${Object.keys(facts.tables).length} tables, ${rows} rows, ${outboxFiles} outbox files)`);
    log(`wrote ${out}.sha256 (${sum})`);
    log(args.withKey
      ? 'THIS FILE HOLDS THE AUDIT KEY: anyone with it can rewrite the audit chain undetected. Keep it apart from other copies.'
      : 'the audit key and the session secret are not in this file: keep a copy of them separately (see the README)');
  } finally {
    rmSync(staging, { recursive: true, force: true });
    target.release();
  }
}

function copyOutbox(from: string, to: string): number {
  if (!existsSync(from)) return 0;
  const files = readdirSync(from).filter((f) => f.endsWith('.eml'));
  if (files.length) mkdirSync(to);
  for (const f of files) cpSync(path.join(from, f), path.join(to, f));
  return files.length;
}

function auditKeyOf(dataRoot: string): string {
  if (process.env.AUDIT_KEY) return process.env.AUDIT_KEY;
  const file = path.join(dataRoot, 'audit-key');
  if (!existsSync(file)) throw new Error(`--include-audit-key: there is no AUDIT_KEY and no ${file}`);
  return readFileSync(file, 'utf8').trim();
}

main().catch((err) => {
  console.error(`[backup] failed: ${(err as Error).message}`);
  process.exit(1);
});
