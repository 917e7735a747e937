import { sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';

type Rows<T> = { rows: T[] };
const ids = async (db: Executor, q: SQL) => ((await db.execute(q)) as unknown as Rows<{ holder_id: string }>).rows.map((r) => r.holder_id);

// Who the sweep re-decides: each query finds people whose recorded state is behind what has happened by now.

/** People with a period past its end and nothing recorded about it yet: their lapse gets recorded. */
export function lapseCandidates(db: Executor, now: Date, limit: number) {
  const t = now.toISOString();
  return ids(db, sql`
    select distinct p.holder_id from authorisation_periods p
    where p.ends_at <= ${t}::timestamptz
      and not exists (select 1 from authorisation_events e where e.period_id = p.id and e.kind in ('lapsed', 'revoked', 'ended'))
      and not exists (select 1 from authorisation_periods n where n.authorisation_id = p.authorisation_id and n.starts_at >= p.ends_at and n.starts_at <= ${t}::timestamptz)
    limit ${limit}`);
}

/** People on a live-work scope whose certificate has been expired for the scope's grace period, not yet suspended for it. */
export function graceCandidates(db: Executor, now: Date, limit: number) {
  const t = now.toISOString();
  return ids(db, sql`
    select distinct p.holder_id from authorisation_periods p
    join scopes s on s.id = p.scope_id and s.allows_live_work
    join scope_requirements q on q.scope_id = s.id and q.kind = 'certificate'
    cross join lateral (
      select max(c.valid_until) as last_until from external_certificates c
      where c.holder_id = p.holder_id and c.kind = q.certificate_kind and c.status = 'verified') c
    where p.during @> ${t}::timestamptz
      and c.last_until is not null and c.last_until <= ${t}::timestamptz
      and c.last_until + make_interval(days => s.certificate_grace_days) <= ${t}::timestamptz
      and not exists (select 1 from authorisation_events e where e.period_id = p.id and e.kind = 'suspended'
        and e.cause = 'certificate:' || q.certificate_kind and e.effective_at >= c.last_until)
    limit ${limit}`);
}

/** People whose re-read deadline for a procedure a running period rests on has not yet shortened that period. */
export function rereadCandidates(db: Executor, now: Date, limit: number) {
  const t = now.toISOString();
  return ids(db, sql`
    select distinct p.holder_id from authorisation_periods p
    join users u on u.id = p.holder_id
    join sites st on st.id = u.site_id
    join scope_requirements q on q.scope_id = p.scope_id and q.kind = 'procedure_ack'
    join procedure_versions v on v.procedure_id = q.procedure_id and v.status = 'published'
    join procedure_reread_requests r on r.version_id = v.id and r.user_id = p.holder_id
    where p.during @> ${t}::timestamptz
      and p.ends_at > ((r.due_on + 1)::timestamp at time zone st.time_zone)
      and not exists (select 1 from procedure_acknowledgements a where a.user_id = p.holder_id and a.procedure_id = q.procedure_id and a.version_number >= coalesce(v.ack_from_number, v.number))
    limit ${limit}`);
}

/**
 * A safety net for flows that record an acknowledgement without re-deciding in their own transaction:
 * people who acknowledged, in the last two days, a procedure a scope rests on, and who do not hold that
 * scope at its full validity now.
 */
export function acknowledgementCandidates(db: Executor, now: Date, limit: number) {
  const t = now.toISOString();
  return ids(db, sql`
    select distinct a.user_id as holder_id from procedure_acknowledgements a
    join scope_requirements q on q.procedure_id = a.procedure_id and q.kind = 'procedure_ack'
    join scopes s on s.id = q.scope_id and s.active
    join users u on u.id = a.user_id and u.active
    where a.acknowledged_at > ${t}::timestamptz - interval '2 days' and a.acknowledged_at <= ${t}::timestamptz
      and not exists (select 1 from authorisation_periods p where p.holder_id = a.user_id and p.scope_id = s.id
        and p.during @> ${t}::timestamptz and p.ends_at = p.validity_ends_at)
    limit ${limit}`);
}

/** Scopes created or edited since everyone they concern was last re-decided for them. */
export async function changedScopes(db: Executor) {
  // The moment as text keeps its microseconds, so marking it done matches exactly what was read.
  const r = (await db.execute(sql`select id, updated_at::text as seen from scopes where redecided_at is distinct from updated_at order by updated_at`)) as unknown as Rows<{ id: string; seen: string }>;
  return r.rows.map((x) => ({ id: x.id, seen: x.seen }));
}

/**
 * Everyone a scope's change concerns: active people with some evidence for every one of its requirements
 * (a superset of who meets them now; the decision itself is exact), and whoever holds a running period of it.
 */
export function scopeCandidates(db: Executor, scopeId: string, now: Date) {
  const t = now.toISOString();
  return ids(db, sql`
    select u.id as holder_id from users u
    where u.active and exists (select 1 from scope_requirements q0 where q0.scope_id = ${scopeId})
      and not exists (select 1 from scope_requirements q where q.scope_id = ${scopeId} and not case q.kind
        when 'procedure_ack' then exists (select 1 from procedure_acknowledgements a where a.user_id = u.id and a.procedure_id = q.procedure_id)
        when 'checklist_signoff' then exists (select 1 from signoffs g where g.person_id = u.id and g.procedure_id = q.procedure_id and g.status = 'countersigned')
        when 'practicals' then exists (select 1 from practicals p where p.technician_id = u.id and p.procedure_id = q.procedure_id and p.outcome = 'competent')
        when 'prerequisite' then exists (select 1 from authorisations x where x.holder_id = u.id and x.scope_id = q.prerequisite_scope_id)
        when 'certificate' then exists (select 1 from external_certificates c where c.holder_id = u.id and c.kind = q.certificate_kind and c.status = 'verified')
        else true end)
    union
    select p.holder_id from authorisation_periods p where p.scope_id = ${scopeId} and p.ends_at > ${t}::timestamptz and p.starts_at <= ${t}::timestamptz`);
}

/** Records that a scope, as it stood when `seen`, has been re-decided for everyone (unless edited again since). */
export async function markScopeRedecided(db: Executor, scopeId: string, seen: string) {
  await db.execute(sql`update scopes set redecided_at = updated_at where id = ${scopeId} and updated_at = ${seen}::timestamptz`);
}
