import { and, asc, desc, eq, inArray, lte, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { checklistItems, practicalAttempts } from '../db/schema/index.js';

export type AttemptRow = typeof practicalAttempts.$inferSelect;

export async function insertAttempt(db: Executor, row: typeof practicalAttempts.$inferInsert) {
  await db.insert(practicalAttempts).values(row);
}

/** Every reading of a practical, in the order taken. */
export async function attemptsOf(db: Executor, practicalId: string): Promise<AttemptRow[]> {
  return db.select().from(practicalAttempts).where(eq(practicalAttempts.practicalId, practicalId)).orderBy(asc(practicalAttempts.seq));
}

/** The readings of several practicals taken by a moment, with each item's prompt, in order. */
export async function attemptsOfMany(db: Executor, practicalIds: string[], at: Date) {
  if (!practicalIds.length) return [];
  return db.select({ attempt: practicalAttempts, prompt: checklistItems.prompt }).from(practicalAttempts)
    .innerJoin(checklistItems, eq(checklistItems.id, practicalAttempts.itemId))
    .where(and(inArray(practicalAttempts.practicalId, practicalIds), lte(practicalAttempts.recordedAt, at)))
    .orderBy(asc(practicalAttempts.practicalId), asc(practicalAttempts.seq));
}

export async function lastAttempt(db: Executor, practicalId: string, itemId: string) {
  const [row] = await db.select().from(practicalAttempts)
    .where(and(eq(practicalAttempts.practicalId, practicalId), eq(practicalAttempts.itemId, itemId))).orderBy(desc(practicalAttempts.seq)).limit(1);
  return row;
}

/** A correction starts from every attempt of the original too. */
export async function copyAttempts(db: Executor, fromId: string, toId: string) {
  await db.execute(sql`
    insert into practical_attempts (practical_id, item_id, seq, value, did_not_trip, unit, instrument_id, expected, tolerance, verdict, judged_by, reason, recorded_at, recorded_by)
    select ${toId}, item_id, seq, value, did_not_trip, unit, instrument_id, expected, tolerance, verdict, judged_by, reason, recorded_at, recorded_by
    from practical_attempts where practical_id = ${fromId} order by seq`);
}
