import { sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';

type Result<R> = { rows: R[]; rowCount: number | null };

/**
 * Deletes the stored sessions of one person (connect-pg-simple's table, keyed by the userId the session
 * holds), except `keepSid` when given. A deleted session cannot come back, whatever happens to the person.
 */
export async function deleteSessionsOf(db: Executor, userId: string, keepSid?: string): Promise<number> {
  const q = keepSid
    ? sql`delete from "session" where sess->>'userId' = ${userId} and sid <> ${keepSid}`
    : sql`delete from "session" where sess->>'userId' = ${userId}`;
  const res = (await db.execute(q)) as unknown as Result<never>;
  return res.rowCount ?? 0;
}

/** How many stored sessions a person has (for the people page and for tests of ending them). */
export async function countSessionsOf(db: Executor, userId: string): Promise<number> {
  const res = (await db.execute(sql`select count(*)::int as n from "session" where sess->>'userId' = ${userId}`)) as unknown as Result<{ n: number }>;
  return res.rows[0]?.n ?? 0;
}
