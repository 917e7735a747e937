import { and, asc, count, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { authorisationPeriods, authorisations, scopes, signatures, sites, users } from '../db/schema/index.js';

/** The columns the CASL rules for Authorisation speak about (the holder and the holder's site). */
export const authorisationAccessColumns = { holderId: users.id, siteId: users.siteId };

const summaryColumns = {
  id: authorisations.id,
  holderId: users.id, holderName: users.name, siteId: users.siteId, siteName: sites.name, timeZone: sites.timeZone,
  scopeId: scopes.id, code: scopes.code, title: scopes.title, maxVoltageV: scopes.maxVoltageV, maxCurrentA: scopes.maxCurrentA, allowsLiveWork: scopes.allowsLiveWork,
};
export type SummaryRow = { id: string; holderId: string; holderName: string; siteId: string; siteName: string; timeZone: string; scopeId: string; code: string; title: string; maxVoltageV: number; maxCurrentA: number; allowsLiveWork: boolean };

function summaries(db: Executor) {
  return db.select(summaryColumns).from(authorisations)
    .innerJoin(users, eq(users.id, authorisations.holderId))
    .innerJoin(sites, eq(sites.id, users.siteId))
    .innerJoin(scopes, eq(scopes.id, authorisations.scopeId));
}

export async function summaryOf(db: Executor, id: string): Promise<SummaryRow | undefined> {
  const [row] = await summaries(db).where(eq(authorisations.id, id));
  return row;
}

/** Several authorisations' summaries in one query. */
export async function summariesOf(db: Executor, ids: string[]): Promise<SummaryRow[]> {
  return ids.length ? summaries(db).where(inArray(authorisations.id, ids)) : [];
}

export async function summariesOfHolder(db: Executor, holderId: string): Promise<SummaryRow[]> {
  return summaries(db).where(eq(authorisations.holderId, holderId)).orderBy(asc(scopes.code));
}

export interface ListFilter {
  access: SQL;
  holderId?: string;
  siteId?: string;
  scopeId?: string;
  q?: string;
  page: number;
  pageSize: number;
}

export async function listSummaries(db: Executor, f: ListFilter) {
  const conds: SQL[] = [f.access];
  if (f.holderId) conds.push(eq(users.id, f.holderId));
  if (f.siteId) conds.push(eq(users.siteId, f.siteId));
  if (f.scopeId) conds.push(eq(scopes.id, f.scopeId));
  if (f.q) conds.push(sql`(${users.name} ilike ${`%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`} or ${scopes.code} ilike ${`%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`})`);
  const where = and(...conds);
  const items = await summaries(db).where(where).orderBy(asc(users.name), asc(scopes.code), asc(authorisations.id)).limit(f.pageSize).offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(authorisations)
    .innerJoin(users, eq(users.id, authorisations.holderId)).innerJoin(scopes, eq(scopes.id, authorisations.scopeId)).where(where);
  return { items, total };
}

/** Periods in force now that end within the window, soonest first: who is due for renewal. */
export async function dueSummaries(db: Executor, f: { access: SQL; siteId?: string; now: Date; until: Date; page: number; pageSize: number }) {
  const conds: SQL[] = [
    f.access, eq(users.active, true),
    sql`${authorisationPeriods.during} @> ${f.now.toISOString()}::timestamptz`,
    sql`${authorisationPeriods.endsAt} <= ${f.until.toISOString()}::timestamptz`,
  ];
  if (f.siteId) conds.push(eq(users.siteId, f.siteId));
  const where = and(...conds);
  const base = () => db.select(summaryColumns).from(authorisationPeriods)
    .innerJoin(authorisations, eq(authorisations.id, authorisationPeriods.authorisationId))
    .innerJoin(users, eq(users.id, authorisations.holderId))
    .innerJoin(sites, eq(sites.id, users.siteId))
    .innerJoin(scopes, eq(scopes.id, authorisations.scopeId));
  const items = await base().where(where).orderBy(asc(authorisationPeriods.endsAt), asc(authorisations.id)).limit(f.pageSize).offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(authorisationPeriods)
    .innerJoin(authorisations, eq(authorisations.id, authorisationPeriods.authorisationId))
    .innerJoin(users, eq(users.id, authorisations.holderId)).where(where);
  return { items, total };
}

export async function namesOf(db: Executor, ids: string[]) {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map<string, string>();
  const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, unique));
  return new Map(rows.map((r) => [r.id, r.name]));
}

export async function signaturesByIds(db: Executor, ids: string[]) {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map<string, typeof signatures.$inferSelect>();
  const rows = await db.select().from(signatures).where(inArray(signatures.id, unique));
  return new Map(rows.map((r) => [r.id, r]));
}
