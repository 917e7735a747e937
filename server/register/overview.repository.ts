import { sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import type { AuthorisationState } from '../../shared/authorisations/kinds.js';
import { spanSelect, type RegisterWhere } from './register.repository.js';
import { rowsOf } from './rows.js';

const RUNNING = sql`st.state in ('active', 'suspended', 'renewal_submitted')`;
const iso = (d: Date) => sql`${d.toISOString()}::timestamptz`;

/** Counts by site, scope and state at the moment: grouped on the spans first, named after (50 sites × the scopes). */
export async function stateCounts(db: Executor, f: RegisterWhere) {
  return rowsOf<{ siteId: string; siteCode: string; scopeId: string; scopeCode: string; state: AuthorisationState; n: number }>(db, sql`
    select c.site_id as "siteId", si.code as "siteCode", c.scope_id as "scopeId", s.code as "scopeCode", c.state, c.n
    from (${spanSelect(f, sql`users.site_id, st.scope_id, st.state, count(*)::int as n`, ['si'])} group by 1, 2, 3) c
    join sites si on si.id = c.site_id join scopes s on s.id = c.scope_id
    order by si.code, s.code, c.state`);
}

/**
 * Running authorisations that end within `days` of the moment (running then, so ending after it), by whole days to go and by week to go, in
 * one pass: the windows are sums of the days, the chart is the weeks.
 */
export async function expiries(db: Executor, f: RegisterWhere, windowsDays: readonly number[], weeks: number) {
  const t = iso(f.moment.at);
  const left = sql`extract(epoch from (pe.ends_at - ${t}))`;
  const rows = await rowsOf<{ day: number | null; week: number | null; n: number }>(db, sql`
    select ceil(${left} / 86400)::int as day, floor(${left} / 604800)::int as week, count(*)::int as n
    from (${spanSelect(f, sql`pe.ends_at`, ['pe'])} and ${RUNNING} and pe.ends_at > ${t} and pe.ends_at <= ${t} + ${`${Math.max(weeks * 7, ...windowsDays)} days`}::interval) pe
    group by grouping sets ((1), (2))`);
  const days = rows.filter((r) => r.day !== null);
  return {
    windows: windowsDays.map((d) => ({ days: d, n: days.filter((r) => r.day! <= d).reduce((n, r) => n + r.n, 0) })),
    weeks: rows.filter((r) => r.week !== null && r.week < weeks).map((r) => ({ week: r.week!, n: r.n })),
  };
}

/** Re-reads asked of people and not done by the due day at their site (answered by acknowledging that version or a later one). */
export async function overdueAcknowledgements(db: Executor, access: SQL, now: Date, siteId: string | undefined, limit: number) {
  const site = siteId ? sql`and users.site_id = ${siteId}` : sql``;
  const rows = await rowsOf<{ personId: string; personName: string; siteCode: string; procedureCode: string; versionNumber: number; dueOn: string; total: string }>(db, sql`select users.id as "personId", users.name as "personName", si.code as "siteCode", p.code as "procedureCode",
      v.number as "versionNumber", q.due_on as "dueOn", count(*) over () as total
    from procedure_reread_requests q
    join users on users.id = q.user_id join sites si on si.id = users.site_id
    join procedure_versions v on v.id = q.version_id join procedures p on p.id = q.procedure_id
    where ${access} ${site} and users.active and v.status = 'published'
      and q.due_on < (${iso(now)} at time zone si.time_zone)::date
      and not exists (select 1 from procedure_acknowledgements k where k.procedure_id = q.procedure_id and k.user_id = q.user_id and k.version_number >= v.number)
    order by q.due_on, users.name limit ${limit}`);
  return { n: rows.length ? Number(rows[0].total) : 0, items: rows.map(({ total: _t, ...r }) => r) };
}
