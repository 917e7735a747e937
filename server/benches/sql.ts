import { sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';

/** A substring match with the user's %, _ and \ taken literally. */
export function likePattern(q: string): string {
  return `%${q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
}

/** Today's calendar date where the row's site is, at the business instant `now`. */
export function localToday(now: Date, timeZoneColumn: AnyPgColumn): SQL {
  return sql`((${now.toISOString()}::timestamptz at time zone ${timeZoneColumn})::date)`;
}
