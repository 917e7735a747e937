import type { SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';

/** Runs hand-written SQL and returns its rows typed as the caller says (the executor types them as unknown). */
export async function rowsOf<T>(db: Executor, query: SQL): Promise<T[]> {
  const res = (await db.execute(query)) as unknown as { rows: T[] };
  return res.rows;
}
