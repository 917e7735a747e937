import { sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import type { RegisterState } from '../../shared/register/kinds.js';
import { stateSource, type Moment } from './state.sql.js';
import { rowsOf } from './rows.js';

export interface MatrixWhere {
  access: SQL;
  moment: Moment;
  siteId?: string;
  q?: string;
  liveWork?: boolean;
}

interface Raw {
  personId: string;
  name: string;
  active: boolean;
  siteCode: string;
  timeZone: string;
  total: string;
  authorisationId: string | null;
  scopeId: string | null;
  endsAt: string | Date | null;
  state: RegisterState | null;
}

/**
 * One page of people (bench staff, and anyone who ever held a scope, on record by the moment) with their
 * state per scope at that moment, as one query: the page of people first, then each one's authorisations.
 */
export async function matrixPage(db: Executor, f: MatrixWhere, page: number, pageSize: number) {
  const conds: SQL[] = [f.access, sql`users.created_at <= ${f.moment.at.toISOString()}::timestamptz`, sql`(exists (select 1 from user_roles r
    where r.user_id = users.id and r.role in ('technician', 'assessor')) or exists (select 1 from authorisations h where h.holder_id = users.id))`];
  if (f.siteId) conds.push(sql`users.site_id = ${f.siteId}`);
  if (f.q) conds.push(sql`users.name ilike ${`%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`}`);
  const live = f.liveWork === undefined ? sql`` : sql`and s.allows_live_work = ${f.liveWork}`;
  return rowsOf<Raw>(db, sql`
    with people as (
      select users.id, users.name, users.active, si.code as site_code, si.time_zone, count(*) over () as total
      from users join sites si on si.id = users.site_id
      where ${sql.join(conds, sql` and `)}
      order by users.name, users.id limit ${pageSize} offset ${(page - 1) * pageSize})
    select people.id as "personId", people.name, people.active, people.site_code as "siteCode", people.time_zone as "timeZone", people.total,
      x.id as "authorisationId", x.scope_id as "scopeId", x.ends_at as "endsAt", x.state
    from people left join lateral (
      select a.id, a.scope_id, pe.ends_at, st.state from authorisations a join scopes s on s.id = a.scope_id
      ${stateSource(f.moment)}
      where a.holder_id = people.id ${live}) x on true
    order by people.name, people.id`);
}

/** The matrix's columns: every scope, live-work ones only or none of them when asked. */
export async function matrixScopes(db: Executor, liveWork?: boolean) {
  return rowsOf<{ id: string; code: string; title: string; allowsLiveWork: boolean }>(db, sql`select id, code, title, allows_live_work as "allowsLiveWork" from scopes
    ${liveWork === undefined ? sql`` : sql`where allows_live_work = ${liveWork}`} order by code`);
}
