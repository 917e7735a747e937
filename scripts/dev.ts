// npm run dev: the same database as npm start, the API server restarting on change, Vite with hot reload.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { runMigrations } from '../server/db/migrate.js';
import { createDatabase, createPool } from '../server/db/client.js';
import { assertAppLogin } from '../server/db/login-check.js';
import { systemClock } from '../server/clock.js';
import { seedDemoIfEmpty } from '../server/seed/index.js';
import { localDatabase, persistentAuditKey, persistentSecret } from './lib/local-db.js';
import { portOrFree } from './lib/ports.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dataRoot = path.resolve(process.env.BREAKOVER_DATA_DIR ?? path.join(root, '.data'));
const log = (s: string) => console.log(`[dev] ${s}`);

async function main() {
  const db = await localDatabase(root, dataRoot, log);
  await runMigrations(db.ownerUrl);
  // The seed goes through the app's own repositories, so it runs as the app's login too.
  await assertAppLogin(db.url);
  const pool = createPool(db.url, 2);
  await seedDemoIfEmpty(createDatabase(pool), systemClock);
  await pool.end();
  const apiPort = await portOrFree(3000);
  const vitePort = await portOrFree(5173);
  const viteUrl = `http://localhost:${vitePort}`;
  const env = {
    ...process.env,
    DATABASE_URL: db.url,
    DATABASE_OWNER_URL: undefined, // the server never needs the owner's login
    PORT: String(apiPort),
    PUBLIC_URL: viteUrl,
    EXTRA_ORIGINS: `http://127.0.0.1:${vitePort},http://localhost:${apiPort}`,
    SESSION_SECRET: process.env.SESSION_SECRET ?? persistentSecret(dataRoot),
    AUDIT_KEY: process.env.AUDIT_KEY ?? persistentAuditKey(dataRoot),
    AUDIT_ANCHOR_DIR: process.env.AUDIT_ANCHOR_DIR ?? dataRoot,
    MAIL_OUTBOX_DIR: process.env.MAIL_OUTBOX_DIR ?? path.join(root, 'mail-outbox'),
    BREAKOVER_API_URL: `http://127.0.0.1:${apiPort}`,
  };
  const bin = (n: string) => path.join(root, 'node_modules', '.bin', n);
  const children: ChildProcess[] = [
    spawn(bin('tsx'), ['watch', '--clear-screen=false', 'server/index.ts'], { cwd: root, env, stdio: 'inherit' }),
    spawn(bin('vite'), ['--port', String(vitePort), '--strictPort'], { cwd: root, env, stdio: 'inherit' }),
  ];
  log(`open ${viteUrl} (API on port ${apiPort}, database ${db.where})`);
  const stop = () => {
    for (const c of children) c.kill('SIGTERM');
    setTimeout(() => {
      db.stop();
      process.exit(0);
    }, 1500);
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  console.error(`[dev] ${(err as Error).message}`);
  process.exit(1);
});
