import { and, asc, count, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { instruments, sites } from '../db/schema/index.js';
import { likePattern, localToday } from './sql.js';

export type InstrumentInsert = typeof instruments.$inferInsert;

function selectInstruments(db: Executor) {
  return db
    .select({ instrument: instruments, siteCode: sites.code, siteName: sites.name, timeZone: sites.timeZone })
    .from(instruments)
    .innerJoin(sites, eq(sites.id, instruments.siteId));
}
export type InstrumentView = Awaited<ReturnType<ReturnType<typeof selectInstruments>['execute']>>[number];

export async function findInstrument(db: Executor, id: string): Promise<InstrumentView | undefined> {
  const [row] = await selectInstruments(db).where(eq(instruments.id, id));
  return row;
}

export async function lockInstrument(db: Executor, id: string) {
  await db.select({ id: instruments.id }).from(instruments).where(eq(instruments.id, id)).for('update');
}

export async function findInstrumentByIdentity(db: Executor, make: string, model: string, serial: string) {
  const [row] = await db
    .select({ id: instruments.id })
    .from(instruments)
    .where(and(eq(instruments.make, make), eq(instruments.model, model), eq(instruments.serial, serial)));
  return row;
}

export async function insertInstrument(db: Executor, row: InstrumentInsert) {
  const [created] = await db.insert(instruments).values(row).returning();
  return created;
}

export async function updateInstrument(db: Executor, id: string, patch: Partial<InstrumentInsert>) {
  await db.update(instruments).set(patch).where(eq(instruments.id, id));
}

export interface InstrumentFilter {
  access: SQL;
  now: Date;
  dueSoonDays: number;
  q?: string;
  siteId?: string;
  kind?: string;
  active?: boolean;
  calibration?: 'expired' | 'due';
  sort: 'serial' | 'kind' | 'calibrationDueOn';
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export async function listInstruments(db: Executor, f: InstrumentFilter) {
  const conds: SQL[] = [f.access];
  if (f.q) {
    const like = likePattern(f.q);
    conds.push(or(ilike(instruments.serial, like), ilike(instruments.make, like), ilike(instruments.model, like)) as SQL);
  }
  if (f.siteId) conds.push(eq(instruments.siteId, f.siteId));
  if (f.kind) conds.push(eq(instruments.kind, f.kind));
  if (f.active !== undefined) conds.push(eq(instruments.active, f.active));
  const today = localToday(f.now, sites.timeZone);
  if (f.calibration === 'expired') conds.push(sql`${instruments.calibrationDueOn} < ${today}`);
  if (f.calibration === 'due') conds.push(sql`${instruments.calibrationDueOn} between ${today} and ${today} + ${f.dueSoonDays}::int`);
  const where = and(...conds);
  const col = { serial: instruments.serial, kind: instruments.kind, calibrationDueOn: instruments.calibrationDueOn }[f.sort];
  const items = await selectInstruments(db)
    .where(where)
    .orderBy(f.dir === 'asc' ? asc(col) : desc(col), asc(instruments.id))
    .limit(f.pageSize)
    .offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(instruments).innerJoin(sites, eq(sites.id, instruments.siteId)).where(where);
  return { items, total };
}

/** The columns the CASL rules speak about. */
export const instrumentAccessColumns = { siteId: instruments.siteId };
