import { sql, type SQL } from 'drizzle-orm';
import { PgDialect } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { users } from '../db/schema/index.js';
import type { RegisterSort, RegisterState } from '../../shared/register/kinds.js';
import { revisedSince, spanHolds, stateSource, type Moment } from './state.sql.js';
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
  /** Known-then reading only: just the authorisations something was recorded about afterwards. */
  onlyRevised?: boolean;
}

const ORDER: Record<RegisterSort, string> = {
  person: 'users.name %d, s.code, a.id',
  site: 'si.code %d, users.name, s.code, a.id',
  scope: 's.code %d, users.name, a.id',
  expiry: 'pe.ends_at %d, users.name, s.code, a.id',
};

// Filters over the authorisation's columns, named for where they are read: the authorisation row, or a span.
type Cols = { id: string; holder: string; scope: string };
const FROM_AUTH: Cols = { id: 'a.id', holder: 'a.holder_id', scope: 'a.scope_id' };
const FROM_SPAN: Cols = { id: 'st.authorisation_id', holder: 'st.holder_id', scope: 'st.scope_id' };

function conditions(f: RegisterWhere, c: Cols): SQL {
  const conds: SQL[] = [f.access];
  if (f.siteId) conds.push(sql`users.site_id = ${f.siteId}`);
  if (f.scopeId) conds.push(sql`${sql.raw(c.scope)} = ${f.scopeId}`);
  if (f.personId) conds.push(sql`${sql.raw(c.holder)} = ${f.personId}`);
  if (f.liveWork !== undefined) conds.push(sql`s.allows_live_work = ${f.liveWork}`);
  if (f.state) conds.push(sql`st.state = ${f.state}`);
  if (f.q) conds.push(sql`users.name ilike ${`%${f.q.replace(/[%_\\]/g, (ch) => `\\${ch}`)}%`}`);
  if (f.onlyRevised) conds.push(sql`rv.authorisation_id is not null`);
  if (f.authorisationIds) conds.push(f.authorisationIds.length ? sql`${sql.raw(c.id)} in (${sql.join(f.authorisationIds.map((id) => sql`${id}`), sql`, `)})` : sql`false`);
  return sql.join(conds, sql` and `);
}

/** The register's rows at a moment as one query: holders, scopes, the period then and its state then. */
export function registerSelect(f: RegisterWhere, sort: RegisterSort = 'person', dir: 'asc' | 'desc' = 'asc'): SQL {
  return sql`select a.id as "authorisationId", pe.id as "periodId", users.id as "personId", users.name as "personName",
      si.id as "siteId", si.code as "siteCode", si.name as "siteName", si.time_zone as "timeZone",
      s.id as "scopeId", s.code as "scopeCode", s.title as "scopeTitle", s.allows_live_work as "allowsLiveWork",
      s.max_voltage_v as "maxVoltageV", s.max_current_a as "maxCurrentA", pe.origin, pe.starts_at as "startsAt", pe.ends_at as "endsAt",
      st.state, st.since
    from authorisations a
    join users on users.id = a.holder_id
    join sites si on si.id = users.site_id
    join scopes s on s.id = a.scope_id
    ${stateSource(f.moment)}
    where ${conditions(f, FROM_AUTH)}${runningEnd(f)}
    order by ${sql.raw(ORDER[sort].replace('%d', dir))}`;
}

const RUNNING_STATES = new Set(['active', 'suspended', 'renewal_submitted']);

/**
 * A state that is running at the moment belongs to a period that ends after it. Saying so lets the
 * planner walk the periods by end from the moment on, rather than from the oldest, when sorting by expiry.
 */
function runningEnd(f: RegisterWhere): SQL {
  return f.state && RUNNING_STATES.has(f.state) && !f.moment.known ? sql` and pe.ends_at > ${f.moment.at.toISOString()}::timestamptz` : sql``;
}

/**
 * How many rows the register has at the moment. As it took effect: counted from the spans containing the
 * moment (btree, index-only), joined only to what the filters need, so the count never folds a row; the page itself
 * stops at its last row. As recorded then: every row is folded, so that count costs what the rows do.
 */
function countSelect(f: RegisterWhere): SQL {
  if (!f.moment.known) return spanSelect(f, sql`count(*)::int`);
  // Known then: the spans count for every authorisation nothing was recorded about afterwards, plus the fold of the few that had.
  const settled = sql`${spanSelect(f, sql`count(*)::int`)} and st.authorisation_id not in (${revisedSince(f.moment.at)})`;
  return sql`select (${settled}) + (select count(*)::int from (${registerSelect({ ...f, onlyRevised: true })}) r)`;
}

const dialect = new PgDialect();
// Auditors and admins see every row: their condition is plain "true", and a count then needs no join to people.
const everything = (access: SQL) => dialect.sqlToQuery(access).sql.trim() === 'true';

/**
 * Columns of the spans containing the moment (as it took effect), filtered, unordered: for counts and the
 * overview. Joins only what the filters and the asked-for columns need (`with`: sites si, scopes s, periods pe).
 */
export function spanSelect(f: RegisterWhere, columns: SQL, withTables: ('si' | 's' | 'pe')[] = []): SQL {
  const needs = new Set(withTables);
  const people = needs.has('si') || !everything(f.access) || !!f.siteId || !!f.q;
  if (f.liveWork !== undefined) needs.add('s');
  return sql`select ${columns} from authorisation_state_spans st
    ${people ? sql`join users on users.id = st.holder_id` : sql``}
    ${needs.has('si') ? sql`join sites si on si.id = users.site_id` : sql``}
    ${needs.has('s') ? sql`join scopes s on s.id = st.scope_id` : sql``}
    ${needs.has('pe') ? sql`join authorisation_periods pe on pe.id = st.period_id` : sql``}
    where ${spanHolds(f.moment.at)} and ${conditions(f, FROM_SPAN)}`;
}

type Raw = Omit<RegisterRowData, 'startsAt' | 'endsAt' | 'since'> & { startsAt: string | Date; endsAt: string | Date; since: string | Date; total?: string };

export function toRow(r: Raw): RegisterRowData {
  return { ...r, startsAt: new Date(r.startsAt), endsAt: new Date(r.endsAt), since: new Date(r.since), maxCurrentA: Number(r.maxCurrentA) };
}

export async function registerPage(db: Executor, f: RegisterWhere, sort: RegisterSort, dir: 'asc' | 'desc', page: number, pageSize: number) {
  const rows = await rowsOf<Raw>(db, sql`select page.*, (${countSelect(f)}) as total
    from (${registerSelect(f, sort, dir)} limit ${pageSize} offset ${(page - 1) * pageSize}) page`);
  // Past the last page the window has no row to carry the total: count once more, without paging.
  const total = rows.length ? Number(rows[0].total) : page > 1 ? await registerCount(db, f) : 0;
  return { items: rows.map(toRow), total };
}

export async function registerCount(db: Executor, f: RegisterWhere): Promise<number> {
  const [row] = await rowsOf<{ count: number }>(db, countSelect(f));
  return Number(row.count);
}

/** Up to `limit` rows, all at once (the PDF report); `limit + 1` tells the caller there were more. */
export async function registerRows(db: Executor, f: RegisterWhere, sort: RegisterSort, dir: 'asc' | 'desc', limit: number) {
  return (await rowsOf<Raw>(db, sql`${registerSelect(f, sort, dir)} limit ${limit}`)).map(toRow);
}
