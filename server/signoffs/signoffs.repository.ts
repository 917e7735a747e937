import { and, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { benches, signoffEntries, signoffs } from '../db/schema/index.js';
import type { EntryFields, EntryRow } from '../records/records.repository.js';

export type SignoffRow = typeof signoffs.$inferSelect;
export type SignoffInsert = typeof signoffs.$inferInsert;

/** With `lock`, the row is held to the end of the transaction: entries, submission and review queue here. */
export async function findSignoff(db: Executor, id: string, lock = false) {
  const q = db.select().from(signoffs).where(eq(signoffs.id, id));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function insertSignoff(db: Executor, row: SignoffInsert) {
  const [created] = await db.insert(signoffs).values(row).returning();
  return created;
}

export async function updateSignoff(db: Executor, id: string, patch: Partial<SignoffInsert>) {
  const [row] = await db.update(signoffs).set(patch).where(eq(signoffs.id, id)).returning();
  return row;
}

export async function entriesOf(db: Executor, signoffId: string): Promise<EntryRow[]> {
  return db.select().from(signoffEntries).where(eq(signoffEntries.signoffId, signoffId));
}

/** One entry per item: a later save of the same item replaces the earlier one while the sign-off is open. */
export async function saveEntry(db: Executor, signoffId: string, itemId: string, fields: EntryFields) {
  await db
    .insert(signoffEntries)
    .values({ signoffId, itemId, ...fields })
    .onConflictDoUpdate({ target: [signoffEntries.signoffId, signoffEntries.itemId], set: fields });
}

export async function copyEntries(db: Executor, fromId: string, toId: string) {
  await db.execute(sql`
    insert into signoff_entries (signoff_id, item_id, kind, checked, text, evidence_id, value, did_not_trip, unit, instrument_id,
      expected, tolerance, verdict, judged_by, rule_text, source, note, recorded_at, recorded_by)
    select ${toId}, item_id, kind, checked, text, evidence_id, value, did_not_trip, unit, instrument_id,
      expected, tolerance, verdict, judged_by, rule_text, source, note, recorded_at, recorded_by
    from signoff_entries where signoff_id = ${fromId}`);
}

export async function correctionOf(db: Executor, id: string) {
  const [row] = await db.select().from(signoffs).where(eq(signoffs.correctsId, id));
  return row;
}

export async function benchBrief(db: Executor, id: string) {
  const [row] = await db.select({ id: benches.id, code: benches.code, name: benches.name, siteId: benches.siteId }).from(benches).where(and(eq(benches.id, id)));
  return row;
}

/** The columns the CASL rules for Signoff speak about. */
export const signoffAccessColumns = { personId: signoffs.personId, siteId: signoffs.siteId, status: signoffs.status };
