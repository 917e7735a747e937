// npm start: database, migrations, demo data, client build, then the server. Keeps the server and the
// private cluster running (each started again when it stops unexpectedly); stops all of it on Ctrl-C.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { runMigrations } from '../server/db/migrate.js';
import { createDatabase, createPool } from '../server/db/client.js';
import { assertAppLogin } from '../server/db/login-check.js';
import { systemClock } from '../server/clock.js';
import { seedDemoIfEmpty } from '../server/seed/index.js';
import { DEMO_PASSWORD, DEMO_SIGN_INS } from '../server/seed/demo-people.js';
import { localDatabase, persistentAuditKey, persistentSecret } from './lib/local-db.js';
import { buildClientIfStale } from './lib/build.js';
import { portOrFree } from './lib/ports.js';
import { superviseProcess, watchCluster } from './lib/supervise.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dataRoot = path.resolve(process.env.BREAKOVER_DATA_DIR ?? path.join(root, '.data'));
const log = (s: string) => console.log(`[breakover] ${s}`);

async function main() {
  const db = await localDatabase(root, dataRoot, log);
  log(`database: ${db.where}`);
  await runMigrations(db.ownerUrl);
  // The seed goes through the app's own repositories, so it runs as the app's login too.
  await assertAppLogin(db.url);
  const pool = createPool(db.url, 2);
  if (await seedDemoIfEmpty(createDatabase(pool), systemClock)) log('seeded the demo scenario');
  await pool.end();
  if (process.env.SKIP_BUILD !== '1') buildClientIfStale(root, log);

  const port = process.env.PORT ? Number(process.env.PORT) : await portOrFree(3000);
  const publicUrl = process.env.PUBLIC_URL ?? `http://localhost:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: db.url,
    DATABASE_OWNER_URL: undefined, // the server never needs the owner's login
    PORT: String(port),
    PUBLIC_URL: publicUrl,
    EXTRA_ORIGINS: [process.env.EXTRA_ORIGINS, `http://127.0.0.1:${port}`].filter(Boolean).join(','),
    SESSION_SECRET: process.env.SESSION_SECRET ?? persistentSecret(dataRoot),
    AUDIT_KEY: process.env.AUDIT_KEY ?? persistentAuditKey(dataRoot),
    AUDIT_ANCHOR_DIR: process.env.AUDIT_ANCHOR_DIR ?? dataRoot,
    MAIL_OUTBOX_DIR: process.env.MAIL_OUTBOX_DIR ?? path.join(root, 'mail-outbox'),
    STATIC_DIR: path.join(root, 'dist'),
  };
  let stopping = false;
  // The server writes straight to our terminal; whether it is up is asked of its liveness route.
  const server = superviseProcess(
    () => spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server', 'index.ts')], { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit'] }),
    log,
  );
  const stopWatching = db.cluster ? watchCluster(db.cluster, log) : () => undefined;
  const liveUrl = `http://${probeHost(process.env.HOST)}:${port}/api/live`;
  void waitUntilLive(liveUrl, () => stopping).then((up) => up && announce(publicUrl));

  const stop = async (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    log(`${signal}: stopping the server and the database`);
    stopWatching();
    await server.stop('SIGTERM');
    db.stop();
    log('stopped');
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

/** Where to ask a server listening on HOST (all addresses, or one of them). */
function probeHost(host = '127.0.0.1'): string {
  if (host === '0.0.0.0' || host === '::' || host === '') return '127.0.0.1';
  return host.includes(':') ? `[${host}]` : host;
}

/** Polls the liveness route until it answers; false when stopping came first. */
async function waitUntilLive(url: string, stopping: () => boolean): Promise<boolean> {
  while (!stopping()) {
    const ok = await fetch(url, { signal: AbortSignal.timeout(2_000) }).then((r) => r.ok, () => false);
    if (ok) return true;
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

function announce(url: string) {
  const width = Math.max(...DEMO_SIGN_INS.map((s) => s.role.length));
  console.log(`\n  Breakover is running at ${url}\n\n  Demo sign-ins (password for all: ${DEMO_PASSWORD})`);
  for (const s of DEMO_SIGN_INS) console.log(`    ${s.role.padEnd(width)}  ${s.email}`);
  console.log('\n  Press Ctrl-C to stop.\n');
}

main().catch((err) => {
  console.error(`[breakover] could not start: ${(err as Error).message}`);
  process.exit(1);
});
