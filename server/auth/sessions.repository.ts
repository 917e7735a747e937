import { sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';

/**
 * Deletes the stored sessions of one person (connect-pg-simple's table, keyed by the userId the session
 * holds), except `keepSid` when given. A deleted session cannot come back, whatever happens to the person.
 */
export async function deleteSessionsOf(db: Executor, userId: string, keepSid?: string): Promise<number> {
  const res = keepSid
    ? await db.execute(sql`delete from "session" where sess->>'userId' = ${userId} and sid <> ${keepSid}`)
    : await db.execute(sql`delete from "session" where sess->>'userId' = ${userId}`);
  return res.rowCount ?? 0;
}

/** How many stored sessions a person has (for the people page and for tests of ending them). */
export async function countSessionsOf(db: Executor, userId: string): Promise<number> {
  const res = await db.execute<{ n: number }>(sql`select count(*)::int as n from "session" where sess->>'userId' = ${userId}`);
  return res.rows[0]?.n ?? 0;
}
