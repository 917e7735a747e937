import { sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import type { AuthorisationState } from '../../shared/authorisations/kinds.js';
import { spanSelect, type RegisterWhere } from './register.repository.js';
import { rowsOf } from './rows.js';

const RUNNING = sql`r.state in ('active', 'suspended', 'renewal_submitted')`;
const iso = (d: Date) => sql`${d.toISOString()}::timestamptz`;
const COLUMNS = sql`si.id as "siteId", si.code as "siteCode", s.id as "scopeId", s.code as "scopeCode", st.state, pe.ends_at as "endsAt"`;

/** Counts by site, scope and state at the moment (a register with every row, grouped). */
export async function stateCounts(db: Executor, f: RegisterWhere) {
  return rowsOf<{ siteId: string; siteCode: string; scopeId: string; scopeCode: string; state: AuthorisationState; n: number }>(db, sql`select r."siteId", r."siteCode", r."scopeId", r."scopeCode", r.state, count(*)::int as n
    from (${spanSelect(f, COLUMNS, ['si', 's', 'pe'])}) r group by 1, 2, 3, 4, 5 order by 2, 4, 5`);
}

/** Running authorisations ending within each window, and per week over the coming weeks. */
export async function expiries(db: Executor, f: RegisterWhere, windowsDays: readonly number[], weeks: number) {
  const now = f.moment.at;
  const windows = sql.join(windowsDays.map((d, i) => sql`count(*) filter (where r."endsAt" <= ${iso(now)} + ${`${d} days`}::interval)::int as ${sql.raw(`w${i}`)}`), sql`, `);
  const [totals] = await rowsOf<Record<string, number>>(db, sql`select ${windows} from (${spanSelect(f, COLUMNS, ['si', 's', 'pe'])}) r where ${RUNNING}`);
  const byWeek = await rowsOf<{ week: number; n: number }>(db, sql`select floor(extract(epoch from (r."endsAt" - ${iso(now)})) / 604800)::int as week, count(*)::int as n
    from (${spanSelect(f, COLUMNS, ['si', 's', 'pe'])}) r where ${RUNNING} and r."endsAt" <= ${iso(now)} + ${`${weeks * 7} days`}::interval group by 1 order by 1`);
  return {
    windows: windowsDays.map((days, i) => ({ days, n: Number(totals?.[`w${i}`] ?? 0) })),
    weeks: byWeek,
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
