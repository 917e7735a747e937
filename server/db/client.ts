import pg from 'pg';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import * as schema from './schema/index.js';

export type Schema = typeof schema;
export type Database = NodePgDatabase<Schema> & { $client: pg.Pool };
/** A database handle or an open transaction: repositories accept either. */
export type Executor = PgDatabase<PgQueryResultHKT, Schema>;

// Timestamps come back as Date, dates as plain 'YYYY-MM-DD' strings.
pg.types.setTypeParser(1082, (v) => v);

/** The application's pool: the URL logs in as breakover_app, which may not alter the audit trail. */
export function createPool(url: string, max = 10): pg.Pool {
  // UTC for the session from the startup packet, so interval arithmetic (an end less N days) is the same
  // whatever the server's default zone. No role here: the login itself is the restricted role.
  return new pg.Pool({ connectionString: url, max, options: '-c TimeZone=UTC' });
}

export function createDatabase(pool: pg.Pool): Database {
  return drizzle(pool, { schema }) as Database;
}

export { schema };
