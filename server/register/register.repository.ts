import { sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { users } from '../db/schema/index.js';
import type { RegisterSort, RegisterState } from '../../shared/register/kinds.js';
import { stateSource, type Moment } from './state.sql.js';
import { rowsOf } from './rows.js';

/** The columns the CASL rules for Register speak about: the holder and the holder's site. */
export const registerAccessColumns = { siteId: users.siteId, personId: users.id };

export interface RegisterRowData {
  authorisationId: string;
  periodId: string;
  personId: string;
  personName: string;
  siteId: string;
  siteCode: string;
  siteName: string;
  timeZone: string;
  scopeId: string;
  scopeCode: string;
  scopeTitle: string;
  allowsLiveWork: boolean;
  maxVoltageV: number;
  maxCurrentA: number;
  origin: string;
  startsAt: Date;
  endsAt: Date;
  state: RegisterState;
  since: Date;
}

export interface RegisterWhere {
  access: SQL;
  moment: Moment;
  siteId?: string;
  scopeId?: string;
  personId?: string;
  q?: string;
  state?: RegisterState;
  liveWork?: boolean;
  authorisationIds?: string[];
}

const ORDER: Record<RegisterSort, string> = {
  person: 'users.name %d, s.code, a.id',
  site: 'si.code %d, users.name, s.code, a.id',
  scope: 's.code %d, users.name, a.id',
  expiry: 'pe.ends_at %d, users.name, s.code, a.id',
};

/** The register's rows at a moment as one query: holders, scopes, the period then and its state then. */
export function registerSelect(f: RegisterWhere, sort: RegisterSort = 'person', dir: 'asc' | 'desc' = 'asc', withTotal = false): SQL {
  const conds: SQL[] = [f.access];
  if (f.siteId) conds.push(sql`users.site_id = ${f.siteId}`);
  if (f.scopeId) conds.push(sql`a.scope_id = ${f.scopeId}`);
  if (f.personId) conds.push(sql`a.holder_id = ${f.personId}`);
  if (f.liveWork !== undefined) conds.push(sql`s.allows_live_work = ${f.liveWork}`);
  if (f.state) conds.push(sql`st.state = ${f.state}`);
  if (f.q) conds.push(sql`users.name ilike ${`%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`}`);
  if (f.authorisationIds) conds.push(f.authorisationIds.length ? sql`a.id in (${sql.join(f.authorisationIds.map((id) => sql`${id}`), sql`, `)})` : sql`false`);
  return sql`select a.id as "authorisationId", pe.id as "periodId", users.id as "personId", users.name as "personName",
      si.id as "siteId", si.code as "siteCode", si.name as "siteName", si.time_zone as "timeZone",
      s.id as "scopeId", s.code as "scopeCode", s.title as "scopeTitle", s.allows_live_work as "allowsLiveWork",
      s.max_voltage_v as "maxVoltageV", s.max_current_a as "maxCurrentA", pe.origin, pe.starts_at as "startsAt", pe.ends_at as "endsAt",
      st.state, st.since ${withTotal ? sql`, count(*) over () as total` : sql``}
    from authorisations a
    join users on users.id = a.holder_id
    join sites si on si.id = users.site_id
    join scopes s on s.id = a.scope_id
    ${stateSource(f.moment)}
    where ${sql.join(conds, sql` and `)}
    order by ${sql.raw(ORDER[sort].replace('%d', dir))}`;
}

type Raw = Omit<RegisterRowData, 'startsAt' | 'endsAt' | 'since'> & { startsAt: string | Date; endsAt: string | Date; since: string | Date; total?: string };

export function toRow(r: Raw): RegisterRowData {
  return { ...r, startsAt: new Date(r.startsAt), endsAt: new Date(r.endsAt), since: new Date(r.since), maxCurrentA: Number(r.maxCurrentA) };
}

export async function registerPage(db: Executor, f: RegisterWhere, sort: RegisterSort, dir: 'asc' | 'desc', page: number, pageSize: number) {
  const rows = await rowsOf<Raw>(db, sql`${registerSelect(f, sort, dir, true)} limit ${pageSize} offset ${(page - 1) * pageSize}`);
  // Past the last page the window has no row to carry the total: count once more, without paging.
  const total = rows.length ? Number(rows[0].total) : page > 1 ? await registerCount(db, f) : 0;
  return { items: rows.map(toRow), total };
}

export async function registerCount(db: Executor, f: RegisterWhere): Promise<number> {
  const [row] = await rowsOf<{ n: number }>(db, sql`select count(*)::int as n from (${registerSelect(f)}) r`);
  return Number(row.n);
}

/** Up to `limit` rows, all at once (the PDF report); `limit + 1` tells the caller there were more. */
export async function registerRows(db: Executor, f: RegisterWhere, sort: RegisterSort, dir: 'asc' | 'desc', limit: number) {
  return (await rowsOf<Raw>(db, sql`${registerSelect(f, sort, dir)} limit ${limit}`)).map(toRow);
}
