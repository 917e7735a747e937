import { and, asc, eq, ilike, inArray, max, ne, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { benches, practicalEntries, practicalHoldPoints, practicals, scopes, userRoles, users } from '../db/schema/index.js';
import type { EntryFields, EntryRow } from '../records/records.repository.js';
import { likePattern } from '../benches/sql.js';

export type PracticalRow = typeof practicals.$inferSelect;
export type PracticalInsert = typeof practicals.$inferInsert;
export type HoldPointRow = typeof practicalHoldPoints.$inferSelect;

export async function findPractical(db: Executor, id: string, lock = false) {
  const q = db.select().from(practicals).where(eq(practicals.id, id));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function insertPractical(db: Executor, row: PracticalInsert) {
  const [created] = await db.insert(practicals).values(row).returning();
  return created;
}

export async function updatePractical(db: Executor, id: string, patch: Partial<PracticalInsert>) {
  await db.update(practicals).set(patch).where(eq(practicals.id, id));
}

export async function entriesOf(db: Executor, practicalId: string): Promise<EntryRow[]> {
  return db.select().from(practicalEntries).where(eq(practicalEntries.practicalId, practicalId));
}

export async function saveEntry(db: Executor, practicalId: string, itemId: string, fields: EntryFields & { seq: number }) {
  await db.insert(practicalEntries).values({ practicalId, itemId, ...fields }).onConflictDoUpdate({ target: [practicalEntries.practicalId, practicalEntries.itemId], set: fields });
}

/** The next number in the order things were done at the bench (call with the practical locked). */
export async function nextSeq(db: Executor, practicalId: string): Promise<number> {
  const [[e], [h]] = await Promise.all([
    db.select({ n: max(practicalEntries.seq) }).from(practicalEntries).where(eq(practicalEntries.practicalId, practicalId)),
    db.select({ n: max(practicalHoldPoints.seq) }).from(practicalHoldPoints).where(eq(practicalHoldPoints.practicalId, practicalId)),
  ]);
  return Math.max(e?.n ?? 0, h?.n ?? 0) + 1;
}

export async function witnessedOf(db: Executor, practicalId: string): Promise<HoldPointRow[]> {
  return db.select().from(practicalHoldPoints).where(eq(practicalHoldPoints.practicalId, practicalId)).orderBy(asc(practicalHoldPoints.position));
}

export async function insertHoldPoint(db: Executor, row: typeof practicalHoldPoints.$inferInsert) {
  await db.insert(practicalHoldPoints).values(row);
}

/** A correction starts from what the original recorded, entries and witnessed hold points with their times. */
export async function copyRecord(db: Executor, fromId: string, toId: string) {
  await db.execute(sql`
    insert into practical_entries (practical_id, item_id, kind, checked, text, evidence_id, value, did_not_trip, unit, instrument_id,
      expected, tolerance, verdict, judged_by, rule_text, source, note, recorded_at, recorded_by, seq)
    select ${toId}, item_id, kind, checked, text, evidence_id, value, did_not_trip, unit, instrument_id,
      expected, tolerance, verdict, judged_by, rule_text, source, note, recorded_at, recorded_by, seq
    from practical_entries where practical_id = ${fromId}`);
  await db.execute(sql`
    insert into practical_hold_points (practical_id, step_key, position, witnessed_at, witnessed_by, note, seq)
    select ${toId}, step_key, position, witnessed_at, witnessed_by, note, seq from practical_hold_points where practical_id = ${fromId} order by position`);
}

export async function correctionOf(db: Executor, id: string) {
  const [row] = await db.select().from(practicals).where(eq(practicals.correctsId, id));
  return row;
}

export async function scopeBrief(db: Executor, id: string) {
  const [row] = await db.select({ id: scopes.id, code: scopes.code, title: scopes.title }).from(scopes).where(eq(scopes.id, id));
  return row;
}

export async function benchOf(db: Executor, id: string) {
  const [row] = await db.select().from(benches).where(eq(benches.id, id));
  return row;
}

/** Active technicians whose own site is one of `siteIds`, other than the assessor: whom they may assess. */
export async function technicianCandidates(db: Executor, siteIds: string[], exceptId: string, q?: string) {
  if (!siteIds.length) return [];
  const conds: SQL[] = [eq(users.active, true), inArray(users.siteId, siteIds), ne(users.id, exceptId), eq(userRoles.role, 'technician')];
  if (q) conds.push(or(ilike(users.name, likePattern(q)), ilike(users.email, likePattern(q))) as SQL);
  return db
    .select({ id: users.id, name: users.name, email: users.email, siteId: users.siteId })
    .from(users)
    .innerJoin(userRoles, eq(userRoles.userId, users.id))
    .where(and(...conds))
    .orderBy(asc(users.name), asc(users.id))
    .limit(50);
}

export async function personBrief(db: Executor, id: string) {
  const [row] = await db.select({ id: users.id, name: users.name, email: users.email, siteId: users.siteId, active: users.active }).from(users).where(eq(users.id, id));
  if (!row) return undefined;
  const roles = await db.select({ role: userRoles.role }).from(userRoles).where(eq(userRoles.userId, id));
  return { ...row, roles: roles.map((r) => r.role) };
}

export async function findPersonByEmail(db: Executor, email: string) {
  const [row] = await db.select({ id: users.id, active: users.active }).from(users).where(eq(users.email, email.toLowerCase()));
  return row;
}

/** The columns the CASL rules for Practical speak about. */
export const practicalAccessColumns = { technicianId: practicals.technicianId, assessorId: practicals.assessorId, siteId: practicals.siteId };
