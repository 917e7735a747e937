import { type SQL, and, asc, desc, eq, getTableColumns, gt, inArray, lte, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { authorisationEvents, authorisationPeriods, authorisations } from '../db/schema/index.js';

export type AuthorisationRow = typeof authorisations.$inferSelect;
export type PeriodRow = Omit<typeof authorisationPeriods.$inferSelect, 'during'>;
export type EventRow = typeof authorisationEvents.$inferSelect;
export type EventInsert = typeof authorisationEvents.$inferInsert;

// Every column but the generated range: the code works with starts_at and ends_at.
const { during: _during, ...periodColumns } = getTableColumns(authorisationPeriods);

export async function findAuthorisation(db: Executor, id: string) {
  const [row] = await db.select().from(authorisations).where(eq(authorisations.id, id));
  return row;
}

export async function authorisationFor(db: Executor, holderId: string, scopeId: string) {
  const [row] = await db.select().from(authorisations).where(and(eq(authorisations.holderId, holderId), eq(authorisations.scopeId, scopeId)));
  return row;
}

export async function ensureAuthorisation(db: Executor, holderId: string, scopeId: string, now: Date): Promise<AuthorisationRow> {
  await db.insert(authorisations).values({ holderId, scopeId, createdAt: now }).onConflictDoNothing();
  return (await authorisationFor(db, holderId, scopeId))!;
}

export async function insertPeriod(db: Executor, row: typeof authorisationPeriods.$inferInsert): Promise<PeriodRow> {
  const [created] = await db.insert(authorisationPeriods).values(row).returning(periodColumns);
  return created;
}

export async function setPeriodEnd(db: Executor, id: string, endsAt: Date) {
  await db.update(authorisationPeriods).set({ endsAt }).where(eq(authorisationPeriods.id, id));
}

export async function insertEvent(db: Executor, row: EventInsert): Promise<EventRow> {
  const [created] = await db.insert(authorisationEvents).values(row).returning();
  return created;
}

export async function findPeriod(db: Executor, id: string): Promise<PeriodRow | undefined> {
  const [row] = await db.select(periodColumns).from(authorisationPeriods).where(eq(authorisationPeriods.id, id));
  return row;
}

export async function findPeriods(db: Executor, ids: string[]): Promise<PeriodRow[]> {
  return ids.length ? db.select(periodColumns).from(authorisationPeriods).where(inArray(authorisationPeriods.id, ids)) : [];
}

/** Scopes in which the person has a period that starts after `at` (recorded ahead of the clock). */
export async function scopesWithLaterPeriods(db: Executor, holderId: string, at: Date): Promise<Set<string>> {
  const rows = await db.selectDistinct({ scopeId: authorisationPeriods.scopeId }).from(authorisationPeriods)
    .where(and(eq(authorisationPeriods.holderId, holderId), gt(authorisationPeriods.startsAt, at)));
  return new Set(rows.map((r) => r.scopeId));
}

export async function findPeriodByCode(db: Executor, code: string): Promise<PeriodRow | undefined> {
  const [row] = await db.select(periodColumns).from(authorisationPeriods).where(eq(authorisationPeriods.verificationCode, code));
  return row;
}

export interface LatestFilter {
  holderIds?: string[];
  authorisationIds?: string[];
  scopeIds?: string[];
}

/** For each authorisation, the period that had begun by `at` most recently (the one in force, or the last one). */
export async function latestPeriods(db: Executor, f: LatestFilter, at: Date): Promise<PeriodRow[]> {
  const conds: SQL[] = [lte(authorisationPeriods.startsAt, at)];
  if (f.holderIds) conds.push(f.holderIds.length ? inArray(authorisationPeriods.holderId, f.holderIds) : sql`false`);
  if (f.authorisationIds) conds.push(f.authorisationIds.length ? inArray(authorisationPeriods.authorisationId, f.authorisationIds) : sql`false`);
  if (f.scopeIds) conds.push(f.scopeIds.length ? inArray(authorisationPeriods.scopeId, f.scopeIds) : sql`false`);
  return db
    .selectDistinctOn([authorisationPeriods.authorisationId], periodColumns)
    .from(authorisationPeriods)
    .where(and(...conds))
    .orderBy(authorisationPeriods.authorisationId, desc(authorisationPeriods.startsAt));
}

export async function periodsOf(db: Executor, authorisationId: string): Promise<PeriodRow[]> {
  return db.select(periodColumns).from(authorisationPeriods).where(eq(authorisationPeriods.authorisationId, authorisationId)).orderBy(asc(authorisationPeriods.startsAt));
}

/** Events of the given periods that had taken effect by `at` (all of them without `at`), in the order they apply. */
export async function eventsOf(db: Executor, periodIds: string[], at?: Date): Promise<EventRow[]> {
  if (!periodIds.length) return [];
  const conds: SQL[] = [inArray(authorisationEvents.periodId, periodIds)];
  if (at) conds.push(lte(authorisationEvents.effectiveAt, at));
  return db.select().from(authorisationEvents).where(and(...conds)).orderBy(asc(authorisationEvents.effectiveAt), asc(authorisationEvents.recordedAt), asc(authorisationEvents.id));
}

/** The period that followed this one, if any (a renewal or a later issue). */
export async function nextPeriod(db: Executor, p: PeriodRow): Promise<PeriodRow | undefined> {
  const [row] = await db
    .select(periodColumns)
    .from(authorisationPeriods)
    .where(and(eq(authorisationPeriods.authorisationId, p.authorisationId), sql`${authorisationPeriods.startsAt} >= ${p.endsAt.toISOString()}::timestamptz`))
    .orderBy(asc(authorisationPeriods.startsAt))
    .limit(1);
  return row;
}

/** Periods of one person and scope that share any moment with [from, to). */
export async function overlapping(db: Executor, holderId: string, scopeId: string, from: Date, to: Date): Promise<PeriodRow[]> {
  return db.select(periodColumns).from(authorisationPeriods).where(and(
    eq(authorisationPeriods.holderId, holderId), eq(authorisationPeriods.scopeId, scopeId),
    sql`${authorisationPeriods.during} && tstzrange(${from.toISOString()}::timestamptz, ${to.toISOString()}::timestamptz, '[)')`,
  ));
}
