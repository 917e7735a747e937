import pg from 'pg';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import * as schema from './schema/index.js';
import { consoleOutageLog, watchPool, type OutageLog } from './outage.js';

export type Schema = typeof schema;
export type Database = NodePgDatabase<Schema> & { $client: pg.Pool };
/** A database handle or an open transaction: repositories accept either. */
export type Executor = PgDatabase<PgQueryResultHKT, Schema>;

// Timestamps come back as Date, dates as plain 'YYYY-MM-DD' strings.
pg.types.setTypeParser(1082, (v) => v);

/**
 * Bounds for every pool of ours: a connect that gets no answer fails after 5 s (a request then gets 503,
 * not a hang), and TCP keep-alive notices a peer that vanished without closing the connection.
 */
export const POOL_BOUNDS = { connectionTimeoutMillis: 5_000, keepAlive: true, keepAliveInitialDelayMillis: 10_000 };
/** The server cancels an app statement after this long (the largest exports and imports take a few seconds). */
export const STATEMENT_TIMEOUT_MS = 60_000;

/** The application's pool: the URL logs in as breakover_app, which may not alter the audit trail. */
export function createPool(url: string, max = 10, log: OutageLog = consoleOutageLog): pg.Pool {
  // UTC for the session from the startup packet, so interval arithmetic (an end less N days) is the same
  // whatever the server's default zone. No role here: the login itself is the restricted role.
  const pool = new pg.Pool({ connectionString: url, max, options: '-c TimeZone=UTC', statement_timeout: STATEMENT_TIMEOUT_MS, ...POOL_BOUNDS });
  return watchPool(pool, log);
}

export function createDatabase(pool: pg.Pool): Database {
  return drizzle(pool, { schema }) as Database;
}

export { schema };
