import { and, asc, count, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { benchChecks, benches, sites, users } from '../db/schema/index.js';
import { likePattern, localToday } from './sql.js';

export type BenchInsert = typeof benches.$inferInsert;
export type CheckRow = typeof benchChecks.$inferSelect;

function selectBenches(db: Executor) {
  const latest = db
    .select({ at: benchChecks.at, passed: benchChecks.passed, notes: benchChecks.notes })
    .from(benchChecks)
    .where(eq(benchChecks.benchId, benches.id))
    .orderBy(desc(benchChecks.at), desc(benchChecks.seq))
    .limit(1)
    .as('latest_check');
  return db
    .select({
      bench: benches, siteCode: sites.code, siteName: sites.name, timeZone: sites.timeZone,
      checkAt: latest.at, checkPassed: latest.passed, checkNotes: latest.notes,
    })
    .from(benches)
    .innerJoin(sites, eq(sites.id, benches.siteId))
    .leftJoinLateral(latest, sql`true`);
}
export type BenchView = Awaited<ReturnType<ReturnType<typeof selectBenches>['execute']>>[number];

export async function findBench(db: Executor, id: string): Promise<BenchView | undefined> {
  const [row] = await selectBenches(db).where(eq(benches.id, id));
  return row;
}

export async function lockBench(db: Executor, id: string) {
  await db.select({ id: benches.id }).from(benches).where(eq(benches.id, id)).for('update');
}

export async function findBenchByCode(db: Executor, siteId: string, code: string) {
  const [row] = await db.select({ id: benches.id }).from(benches).where(and(eq(benches.siteId, siteId), eq(benches.code, code)));
  return row;
}

export async function insertBench(db: Executor, row: BenchInsert) {
  const [created] = await db.insert(benches).values(row).returning();
  return created;
}

export async function updateBench(db: Executor, id: string, patch: Partial<BenchInsert>) {
  await db.update(benches).set(patch).where(eq(benches.id, id));
}

export interface BenchFilter {
  access: SQL;
  now: Date;
  dueSoonDays: number;
  q?: string;
  siteId?: string;
  active?: boolean;
  inspection?: 'overdue' | 'due';
  rcdType?: string;
  sort: 'code' | 'name' | 'nextInspectionOn';
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export async function listBenches(db: Executor, f: BenchFilter) {
  const conds: SQL[] = [f.access];
  if (f.q) conds.push(or(ilike(benches.code, likePattern(f.q)), ilike(benches.name, likePattern(f.q))) as SQL);
  if (f.siteId) conds.push(eq(benches.siteId, f.siteId));
  if (f.active !== undefined) conds.push(eq(benches.active, f.active));
  if (f.rcdType) conds.push(eq(benches.rcdType, f.rcdType));
  const today = localToday(f.now, sites.timeZone);
  if (f.inspection === 'overdue') conds.push(sql`${benches.nextInspectionOn} < ${today}`);
  if (f.inspection === 'due') conds.push(sql`${benches.nextInspectionOn} between ${today} and ${today} + ${f.dueSoonDays}::int`);
  const where = and(...conds);
  const col = { code: benches.code, name: benches.name, nextInspectionOn: benches.nextInspectionOn }[f.sort];
  const items = await selectBenches(db)
    .where(where)
    .orderBy(f.dir === 'asc' ? asc(col) : desc(col), asc(benches.id))
    .limit(f.pageSize)
    .offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(benches).innerJoin(sites, eq(sites.id, benches.siteId)).where(where);
  return { items, total };
}

export async function insertCheck(db: Executor, row: typeof benchChecks.$inferInsert) {
  const [created] = await db.insert(benchChecks).values(row).returning();
  return created;
}

export async function findCheck(db: Executor, id: string) {
  const [row] = await db.select({ check: benchChecks, siteId: benches.siteId }).from(benchChecks).innerJoin(benches, eq(benches.id, benchChecks.benchId)).where(eq(benchChecks.id, id));
  return row;
}

export async function listChecks(db: Executor, benchId: string, page: number, pageSize: number) {
  const items = await db
    .select({ check: benchChecks, personName: users.name })
    .from(benchChecks)
    .innerJoin(users, eq(users.id, benchChecks.personId))
    .where(eq(benchChecks.benchId, benchId))
    .orderBy(desc(benchChecks.at), desc(benchChecks.seq))
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  const [{ total }] = await db.select({ total: count() }).from(benchChecks).where(eq(benchChecks.benchId, benchId));
  return { items, total };
}

/** The columns the CASL rules speak about. */
export const benchAccessColumns = { siteId: benches.siteId };
