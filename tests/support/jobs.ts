import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll } from 'vitest';
import { loadConfig } from '../../server/config.js';
import { createApp } from '../../server/app.js';
import { SettableClock } from '../../server/clock.js';
import { createTransport, type MailTransport } from '../../server/mail/transport.js';
import { seedDemoIfEmpty } from '../../server/seed/index.js';
import { createTestDatabase } from './db.js';
import { PUBLIC_URL, TEST_AUDIT_KEY, readOutbox, withOrigin } from './app.js';

const env = (url: string, outbox: string) => ({
  DATABASE_URL: url, PUBLIC_URL, SESSION_SECRET: 'test-secret-'.padEnd(40, 'x'), MAIL_OUTBOX_DIR: outbox, SIGNIN_RATE_LIMIT: '1000',
  AUDIT_KEY: TEST_AUDIT_KEY, AUDIT_ANCHOR_DIR: path.join(outbox, 'anchors'),
  STATIC_DIR: path.join(os.tmpdir(), 'breakover-no-static'),
});

/** A transport that fails while `failing` is set, in front of the real outbox writer. */
export function switchableTransport(real: MailTransport) {
  const state = { failing: false, attempts: 0 };
  const transport: MailTransport = {
    async send(message) {
      state.attempts++;
      if (state.failing) throw new Error('421 4.3.2 mail service not available, try again later');
      return real.send(message);
    },
  };
  return Object.assign(state, { transport });
}

/**
 * The real app with its job queue started (no cron: the tests ask for sweeps), a settable clock and a
 * transport the test can make fail. Like makeTestApp, one per file; cleans up after the file.
 */
export async function makeJobsTestApp(opts: { start?: string } = {}) {
  const database = await createTestDatabase();
  const outbox = mkdtempSync(path.join(os.tmpdir(), 'breakover-outbox-'));
  const clock = new SettableClock(opts.start ?? '2026-03-02T09:00:00Z');
  const config = loadConfig(env(database.url, outbox));
  const transport = switchableTransport(createTransport(config.mail));
  const built = createApp({ config, clock, mailTransport: transport.transport, startJobs: { pollSeconds: 0.5, schedule: false } });
  await built.jobsReady;
  await seedDemoIfEmpty(built.deps.db, clock);
  const children: ChildProcess[] = [];
  afterAll(async () => {
    await stopSecondWorkers();
    await built.close();
    await database.drop();
  });

  /** A second server process: the same code and database, its own pg-boss and worker, its clock at `at`. */
  async function startSecondWorker(at: Date): Promise<ChildProcess> {
    const child = spawn(process.execPath, ['--import', 'tsx', path.resolve('tests/support/reminder-worker.ts')], {
      env: { ...process.env, ...env(database.url, outbox), WORKER_CLOCK: at.toISOString() }, stdio: ['ignore', 'pipe', 'inherit'],
    });
    children.push(child);
    await new Promise<void>((resolve, reject) => {
      child.stdout!.on('data', (d: Buffer) => d.toString().includes('worker ready') && resolve());
      child.once('exit', (code) => reject(new Error(`second worker exited with ${code}`)));
    });
    return child;
  }

  /** Waits (polling the queue, not sleeping a fixed time) until every job has finished. */
  async function waitForJobs(ids: string[], timeoutMs = 60_000) {
    const until = Date.now() + timeoutMs;
    for (;;) {
      const jobs = await Promise.all(ids.map((id) => built.jobs.job(id)));
      if (jobs.every((j) => j && ['completed', 'failed'].includes(j.state))) return jobs.map((j) => j!);
      if (Date.now() > until) throw new Error(`jobs not finished: ${jobs.map((j) => j?.state).join(', ')}`);
      await new Promise((r) => setTimeout(r, 200));
    }
  }

  async function stopSecondWorkers() {
    for (const c of children.splice(0)) {
      if (c.exitCode !== null) continue;
      c.kill('SIGTERM');
      await new Promise((r) => c.once('exit', r));
    }
  }

  return {
    ...built, clock, config, outbox, database, transport, startSecondWorker, stopSecondWorkers, waitForJobs,
    agent: () => withOrigin(built.app),
    request: () => withOrigin(built.app),
    ownerQuery: async (text: string, params: unknown[] = []) => {
      const pg = (await import('pg')).default;
      const c = new pg.Client({ connectionString: database.ownerUrl });
      await c.connect();
      try {
        return await c.query(text, params);
      } finally {
        await c.end();
      }
    },
    mails: () => readOutbox(outbox),
  };
}
export type JobsTestApp = Awaited<ReturnType<typeof makeJobsTestApp>>;
