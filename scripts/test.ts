// npm test: a throw-away PostgreSQL cluster on a free port, a migrated template database, the client
// build for the browser tests, Chromium when missing, then every Vitest project. Exits non-zero on failure.
import { spawnSync, spawn } from 'node:child_process';
import { existsSync, mkdtempSync, chmodSync } from 'node:fs';
import os from 'node:os';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDatabase, findPostgresBin, initCluster, removeCluster, startCluster, stopCluster } from './lib/cluster.js';
import { freePort } from './lib/ports.js';
import { buildClientInto } from './lib/build.js';
import { runMigrations } from '../server/db/migrate.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const log = (s: string) => console.log(`[test] ${s}`);
const CHROMIUM = '/usr/bin/chromium';

function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) throw new Error(`Browser tests need ${CHROMIUM}: install Debian's chromium package (apt-get install -y chromium).`);
  log('installing Debian\'s chromium for the browser tests (apt-get)…');
  for (const args of [['update'], ['install', '-y', '--no-install-recommends', 'chromium', 'fonts-dejavu-core']]) {
    const r = spawnSync('apt-get', args, { stdio: ['ignore', 'ignore', 'inherit'] });
    if (r.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed`);
  }
}

async function main() {
  const args = process.argv.slice(2);
  const wantsBrowser = args.length === 0 || args.some((a) => a.includes('e2e'));
  const bin = findPostgresBin(log);
  const parent = mkdtempSync(path.join(os.tmpdir(), 'breakover-test-'));
  chmodSync(parent, 0o755);
  const dataDir = path.join(parent, 'pg');
  const staticDir = path.join(parent, 'dist');
  const port = await freePort();
  initCluster(bin, dataDir);
  await startCluster(bin, dataDir, port);
  let code = 1;
  try {
    const admin = `postgres://postgres@127.0.0.1:${port}/postgres`;
    await ensureDatabase(admin, 'bo_template');
    await runMigrations(`postgres://postgres@127.0.0.1:${port}/bo_template`);
    log(`test cluster on 127.0.0.1:${port}, template database migrated`);
    if (wantsBrowser) {
      ensureChromium();
      log('building the client for the browser tests…');
      buildClientInto(root, staticDir);
    }
    code = await runVitest(args, {
      TEST_PG_ADMIN_URL: admin,
      TEST_PG_TEMPLATE: 'bo_template',
      TEST_CHROMIUM: CHROMIUM,
      TEST_STATIC_DIR: staticDir,
      BCRYPT_COST: '4',
      // For tests that build their configuration from the environment; makeTestApp sets its own.
      AUDIT_KEY: randomBytes(32).toString('hex'),
      AUDIT_ANCHOR_DIR: path.join(parent, 'anchors'),
    });
  } finally {
    stopCluster(bin, dataDir);
    removeCluster(parent);
  }
  process.exit(code);
}

function runVitest(args: string[], extraEnv: Record<string, string>): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(path.join(root, 'node_modules', '.bin', 'vitest'), ['run', ...args], {
      cwd: root,
      stdio: 'inherit',
      env: { ...process.env, ...extraEnv },
    });
    for (const sig of ['SIGINT', 'SIGTERM'] as const) process.on(sig, () => child.kill(sig));
    child.on('exit', (c) => resolve(c ?? 1));
  });
}

main().catch((err) => {
  console.error(`[test] ${(err as Error).message}`);
  process.exit(1);
});
