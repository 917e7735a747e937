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

/** The application's pool: every connection acts as breakover_app, which may not alter the audit trail. */
export function createPool(url: string, max = 10): pg.Pool {
  // Startup parameters, in force before the first query on every connection: the role, and UTC for the
  // session, so interval arithmetic (an end less N days) is the same whatever the server's default zone.
  return new pg.Pool({ connectionString: url, max, options: '-c role=breakover_app -c TimeZone=UTC' });
}

export function createDatabase(pool: pg.Pool): Database {
  return drizzle(pool, { schema }) as Database;
}

export { schema };
