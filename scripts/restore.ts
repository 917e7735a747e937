// npm run restore -- [--force] FILE: checks FILE and its manifest, restores it into an empty database (the
// private cluster's, or DATABASE_OWNER_URL's), puts its files back, migrates it to this version, and
// compares every table's rows with the manifest. --force first DROPS the database that is there.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { runMigrations } from '../server/db/migrate.js';
import { installationDirs, openTarget } from './lib/backup-target.js';
import { openArchive } from './lib/backup-archive.js';
import { countDifferences, journal } from './lib/backup-manifest.js';
import { dropAndRecreate, ensureAppRole, existingTables, otherSessions, restoreDump } from './lib/restore-db.js';
import { restoreFiles } from './lib/restore-files.js';
import { checkRestored } from './lib/restore-check.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const log = (s: string) => console.log(`[restore] ${s}`);

async function main() {
  const argv = process.argv.slice(2);
  const force = argv.includes('--force');
  const files = argv.filter((a) => a !== '--force');
  if (files.length !== 1 || files[0].startsWith('-')) throw new Error('usage: npm run restore -- [--force] FILE');
  const file = path.resolve(files[0]);
  const { dir, manifest } = await openArchive(file);
  try {
    log(`${path.basename(file)}: checksum and manifest verified (made ${manifest.createdAt}, schema ${manifest.schemaVersion})`);
    if (!journal(root).some((e) => e.tag === manifest.schemaVersion)) {
      throw new Error(`the backup's schema ${manifest.schemaVersion} is unknown to this version of Breakover: restore it with the version that made it, or a newer one`);
    }
    const dirs = installationDirs(root);
    const target = await openTarget(root, dirs.dataRoot, log, true);
    try {
      const others = await otherSessions(target.ownerUrl);
      if (others) throw new Error(`${others} other session(s) are connected to the database: stop the server (npm start) before restoring`);
      const tables = await existingTables(target.ownerUrl);
      if (tables && !force) {
        throw new Error(`the database in ${target.where} is not empty (${tables} tables); nothing was changed. ` +
          'To replace it, run again with --force, which DROPS that database and everything in it.');
      }
      if (tables) {
        log(`--force: DROPPING database "${target.name}" in ${target.where} (${tables} tables) and creating it empty`);
        await dropAndRecreate(target.maintenanceUrl, target.name);
      }
      if (await ensureAppRole(target.ownerUrl)) log('created the role breakover_app (a login with no other rights)');
      await restoreDump(target.bin, target.ownerUrl, path.join(dir, 'database.dump'));
      const restored = await checkRestored.counts(target.ownerUrl);
      const diff = countDifferences(manifest.tables, restored);
      if (diff.length) throw new Error(`the restored rows differ from the manifest:\n  ${diff.join('\n  ')}`);
      printCounts(manifest.tables, restored);
      await runMigrations(target.ownerUrl);
      log(`migrated from ${manifest.schemaVersion} to ${journal(root).at(-1)?.tag}`);
      restoreFiles(dir, dirs, log);
      await checkRestored.chain(target.ownerUrl, dirs, log);
      log(`restored ${file} into ${target.where}`);
    } finally {
      target.release();
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function printCounts(expected: Record<string, number>, restored: Record<string, number>) {
  const names = Object.keys(expected).filter((t) => expected[t] > 0);
  const width = Math.max(...names.map((n) => n.length));
  log(`every table has the rows the manifest lists (${Object.keys(expected).length} tables; empty ones not shown):`);
  console.log(`  ${'table'.padEnd(width)}  ${'backup'.padStart(8)}  ${'restored'.padStart(8)}`);
  for (const n of names) console.log(`  ${n.padEnd(width)}  ${String(expected[n]).padStart(8)}  ${String(restored[n]).padStart(8)}`);
}

main().catch((err) => {
  console.error(`[restore] refused or failed: ${(err as Error).message}`);
  process.exit(1);
});
