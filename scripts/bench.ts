// npm run bench: the design scale in a throw-away cluster, timed through the real app. Prints a table.
import { chmodSync, mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import request from 'supertest';
import { ensureDatabase, findPostgresBin, initCluster, removeCluster, startCluster, stopCluster } from './lib/cluster.js';
import { freePort } from './lib/ports.js';
import { runMigrations } from '../server/db/migrate.js';
import { loadConfig } from '../server/config.js';
import { createApp } from '../server/app.js';
import { SettableClock } from '../server/clock.js';
import { BENCH_SUITES, type BenchContext, type BenchCase } from './bench/index.js';

const log = (s: string) => console.log(`[bench] ${s}`);

async function time(c: BenchCase, runs: number): Promise<number[]> {
  const samples: number[] = [];
  for (let i = 0; i < runs + 2; i++) {
    const t0 = performance.now();
    await c.run();
    if (i >= 2) samples.push(performance.now() - t0); // the first two warm caches and plans
  }
  return samples.sort((a, b) => a - b);
}

async function main() {
  const bin = findPostgresBin(log);
  const parent = mkdtempSync(path.join(os.tmpdir(), 'breakover-bench-'));
  chmodSync(parent, 0o755);
  const dataDir = path.join(parent, 'pg');
  const port = await freePort();
  initCluster(bin, dataDir);
  await startCluster(bin, dataDir, port);
  try {
    await ensureDatabase(`postgres://postgres@127.0.0.1:${port}/postgres`, 'bench');
    const ownerUrl = `postgres://postgres@127.0.0.1:${port}/bench`;
    const url = `postgres://breakover_app@127.0.0.1:${port}/bench`;
    await runMigrations(ownerUrl);
    const clock = new SettableClock('2026-06-01T08:00:00Z');
    // Request lines are not what is measured: only warnings and errors are logged unless LOG_LEVEL says more.
    const config = loadConfig({ DATABASE_URL: url, SESSION_SECRET: 'bench-secret-'.padEnd(40, 'x'), AUDIT_KEY: 'b0'.repeat(32), AUDIT_ANCHOR_DIR: path.join(parent, 'anchors'), SIGNIN_RATE_LIMIT: '100000', MAIL_OUTBOX_DIR: path.join(parent, 'outbox'), STATIC_DIR: path.join(parent, 'none'), LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn' });
    const built = createApp({ config, clock });
    const ctx: BenchContext = { ...built, clock, url, http: request.agent(built.app).set('Origin', new URL(built.deps.config.publicUrl).origin), analyze: () => analyzeAsOwner(ownerUrl) };
    const rows: string[][] = [];
    for (const suite of BENCH_SUITES) {
      const t0 = performance.now();
      const cases = await suite(ctx);
      log(`prepared ${cases.length} case(s) in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
      for (const c of cases) {
        const s = await time(c, c.runs ?? 20);
        const pct = (p: number) => s[Math.min(s.length - 1, Math.floor(p * s.length))];
        rows.push([c.name, c.scale, pct(0.5).toFixed(1), pct(0.95).toFixed(1), c.target ?? '']);
      }
    }
    await built.close();
    printTable(['case', 'data', 'median ms', 'p95 ms', 'target'], rows);
  } finally {
    stopCluster(bin, dataDir);
    removeCluster(parent);
  }
}

/** Fresh planner statistics after bulk loads: only the tables' owner may ANALYZE them, not the app's login. */
async function analyzeAsOwner(ownerUrl: string): Promise<void> {
  const client = new pg.Client({ connectionString: ownerUrl });
  await client.connect();
  try {
    await client.query('analyze');
  } finally {
    await client.end();
  }
}

function printTable(head: string[], rows: string[][]) {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (r: string[]) => '| ' + r.map((c, i) => c.padEnd(widths[i])).join(' | ') + ' |';
  console.log('\n' + line(head));
  console.log('|' + widths.map((w) => '-'.repeat(w + 2)).join('|') + '|');
  for (const r of rows) console.log(line(r));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
