import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { installJobQueues } from '../jobs/install.js';
import { consoleOutageLog, watchPool } from './outage.js';

const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../drizzle');

/** Applies the SQL migrations and sets up the job queue, as the owner (never the application's login). */
export async function runMigrations(ownerUrl: string): Promise<void> {
  const pool = watchPool(new pg.Pool({ connectionString: ownerUrl, max: 1 }), consoleOutageLog);
  try {
    await migrate(drizzle(pool), { migrationsFolder });
  } finally {
    await pool.end();
  }
  await installJobQueues(ownerUrl);
}
