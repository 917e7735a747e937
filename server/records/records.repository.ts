import { inArray } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { instruments, signoffEntries, users } from '../db/schema/index.js';

/** The columns an entry has on either kind of record (sign-off or practical). */
export type EntryRow = Omit<typeof signoffEntries.$inferSelect, 'signoffId'> & { seq?: number | null };
export type EntryFields = Omit<EntryRow, 'id' | 'itemId' | 'seq'>;

/** "Make Model SN serial" for each instrument id, in one query. */
export async function instrumentLabels(db: Executor, ids: string[]): Promise<Map<string, string>> {
  if (!ids.length) return new Map();
  const rows = await db.select({ id: instruments.id, make: instruments.make, model: instruments.model, serial: instruments.serial }).from(instruments).where(inArray(instruments.id, ids));
  return new Map(rows.map((r) => [r.id, `${r.make} ${r.model} SN ${r.serial}`]));
}

export async function peopleNames(db: Executor, ids: string[]): Promise<Map<string, string>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, unique));
  return new Map(rows.map((r) => [r.id, r.name]));
}
