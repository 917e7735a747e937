import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll } from 'vitest';
import { loadConfig } from '../../server/config.js';
import { createApp } from '../../server/app.js';
import type { Logger } from '../../server/logging.js';
import { SettableClock } from '../../server/clock.js';
import pg from 'pg';
import { seedDemoIfEmpty } from '../../server/seed/index.js';
import { createTestDatabase } from './db.js';
import { deliverOnCommit } from './deliver.js';

export const PUBLIC_URL = 'http://breakover.test';
/** The audit key of every test app (64 hex digits); tamper tests rebuild the chain with another. */
export const TEST_AUDIT_KEY = 'a1'.repeat(32);

export interface TestAppOptions {
  seed?: boolean;
  start?: string;
  env?: Record<string, string>;
  /** Where the app's log lines go (a test that reads them); otherwise logging is off. */
  logger?: Logger;
  /** false: mail waits in the outbox until the test delivers it (deliverMail), as if the process died. */
  deliverOnCommit?: boolean;
  /** Rewrites the app's database URL (a test puts a proxy it can cut in between). */
  databaseUrl?: (url: string) => string;
}

/**
 * The real app on a fresh database of its own, with a settable clock and its own outbox folder.
 * Registers its own clean-up; call once per test file (in beforeAll or at module level with await).
 */
export async function makeTestApp(opts: TestAppOptions = {}) {
  const database = await createTestDatabase();
  const outbox = mkdtempSync(path.join(os.tmpdir(), 'breakover-outbox-'));
  const clock = new SettableClock(opts.start ?? '2026-03-02T09:00:00Z');
  const config = loadConfig({
    DATABASE_URL: opts.databaseUrl ? opts.databaseUrl(database.url) : database.url,
    PUBLIC_URL,
    SESSION_SECRET: 'test-secret-'.padEnd(40, 'x'),
    AUDIT_KEY: TEST_AUDIT_KEY,
    AUDIT_ANCHOR_DIR: mkdtempSync(path.join(os.tmpdir(), 'breakover-anchors-')),
    MAIL_OUTBOX_DIR: outbox,
    SIGNIN_RATE_LIMIT: '1000',
    LOG_LEVEL: 'silent',
    STATIC_DIR: path.join(os.tmpdir(), 'breakover-no-static'),
    ...opts.env,
  });
  const built = createApp({ config, clock, logger: opts.logger });
  // No job queue here: the app delivers in-process as soon as a change that wrote mail has committed.
  if (opts.deliverOnCommit !== false) deliverOnCommit(built.deps.mailer);
  if (opts.seed !== false) await seedDemoIfEmpty(built.deps.db, clock);
  afterAll(async () => {
    await built.close();
    await database.drop();
  });
  return {
    ...built,
    clock,
    config,
    outbox,
    database,
    /** One-off requests; a fresh agent each call (no cookie kept), sending Origin as our pages do. */
    request: () => withOrigin(built.app, config.publicUrl),
    /** An agent that keeps its cookies, sending Origin as our pages do (the API refuses writes without it). */
    agent: () => withOrigin(built.app, config.publicUrl),
    /** A connection as the database owner, bypassing the application role: for tamper tests only. */
    ownerQuery: async (text: string, params: unknown[] = []) => {
      const c = new pg.Client({ connectionString: database.ownerUrl });
      await c.connect();
      try {
        return await c.query(text, params);
      } finally {
        await c.end();
      }
    },
    /** Every message delivered to the outbox folder so far, oldest first. */
    mails: () => readOutbox(outbox),
  };
}

export type TestApp = Awaited<ReturnType<typeof makeTestApp>>;

/** A supertest agent whose every request carries the app's own origin, as a browser on our pages sends it. */
export function withOrigin(app: Parameters<typeof request.agent>[0], publicUrl = PUBLIC_URL) {
  const agent = request.agent(app);
  agent.set('Origin', new URL(publicUrl).origin);
  return agent;
}

/** The .eml files in an outbox folder, oldest message first (files are named by when the message was recorded). */
export const readOutbox = (dir: string) => readdirSync(dir).filter((f) => f.endsWith('.eml')).sort().map((f) => readFileSync(path.join(dir, f), 'utf8'));
