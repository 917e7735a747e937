import { sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';

// Planning is set-based: each statement picks what is due, then fans it out to the holder and the
// managers of the holder's site (their own site or one they cover) in one join, not a query per row.

/** Every active manager of each site: by their own site, and by the sites they cover. */
const siteManagers = sql`
  select m.site_id, m.id as manager_id from users m
  join user_roles ur on ur.user_id = m.id and ur.role = 'manager' where m.active
  union
  select us.site_id, m.id from users m
  join user_roles ur on ur.user_id = m.id and ur.role = 'manager'
  join user_sites us on us.user_id = m.id where m.active`;

/**
 * `due` yields (period_id, certificate_id, offset_days, due_at, holder_id, holder_active, site_id);
 * this records one pending send per recipient. The unique key makes a send that exists a no-op.
 */
function fanOut(due: SQL, t: SQL): SQL {
  return sql`with due as (${due}), sm as materialized (${siteManagers})
    insert into reminder_sends (period_id, certificate_id, offset_days, recipient_id, recipient_role, due_at, status, attempts, next_attempt_at, created_at)
    select period_id, certificate_id, offset_days, holder_id, 'holder', due_at, 'pending', 0, ${t}, ${t} from due where holder_active
    union all
    select d.period_id, d.certificate_id, d.offset_days, sm.manager_id, 'manager', d.due_at, 'pending', 0, ${t}, ${t}
    from due d join sm on sm.site_id = d.site_id and sm.manager_id <> d.holder_id
    on conflict do nothing`;
}

/** The latest verified certificate of its kind for its holder (an older one is superseded by it). */
const latestOfKind = sql`not exists (select 1 from external_certificates n
  where n.holder_id = c.holder_id and n.kind = c.kind and n.status = 'verified' and n.valid_until > c.valid_until)`;

/**
 * Records the sends that are due: for each running period (and each certificate a running period rests
 * on) the nearest reminder offset reached, and a notice for what lapsed in the last 30 days.
 */
export async function planSends(db: Executor, now: Date): Promise<number> {
  const t = sql`${now.toISOString()}::timestamptz`;
  const statements = [
    // Reminders before a period ends.
    fanOut(sql`select p.id as period_id, null::uuid as certificate_id, o.d as offset_days, p.ends_at - make_interval(days => o.d) as due_at,
        h.id as holder_id, h.active as holder_active, h.site_id
      from authorisation_periods p
      join scopes s on s.id = p.scope_id
      join users h on h.id = p.holder_id
      cross join lateral (select min(d) as d from unnest(s.reminder_offsets_days) d where p.ends_at - make_interval(days => d) <= ${t}) o
      where p.ends_at > ${t} and p.ends_at <= ${t} + interval '366 days' and p.starts_at <= ${t} and o.d is not null`, t),
    // Notices of a lapse.
    fanOut(sql`select p.id as period_id, null::uuid as certificate_id, 0 as offset_days, p.ends_at as due_at,
        h.id as holder_id, h.active as holder_active, h.site_id
      from authorisation_events e
      join authorisation_periods p on p.id = e.period_id
      join users h on h.id = p.holder_id
      where e.kind = 'lapsed' and e.effective_at <= ${t} and e.effective_at > ${t} - interval '30 days'`, t),
    // Reminders before a certificate that a running period rests on runs out.
    fanOut(sql`select null::uuid as period_id, c.id as certificate_id, o.d as offset_days, c.valid_until - make_interval(days => o.d) as due_at,
        h.id as holder_id, h.active as holder_active, h.site_id
      from external_certificates c
      join users h on h.id = c.holder_id
      cross join lateral (
        select min(d) as d from authorisation_periods p
        join scopes s on s.id = p.scope_id
        join scope_requirements q on q.scope_id = s.id and q.kind = 'certificate' and q.certificate_kind = c.kind
        cross join unnest(s.reminder_offsets_days) d
        where p.holder_id = c.holder_id and p.starts_at <= ${t} and p.ends_at > ${t}
          and c.valid_until - make_interval(days => d) <= ${t}) o
      where c.status = 'verified' and c.valid_until > ${t} and c.valid_until <= ${t} + interval '366 days' and o.d is not null
        and ${latestOfKind}`, t),
    // Notices that such a certificate has run out.
    fanOut(sql`select null::uuid as period_id, c.id as certificate_id, 0 as offset_days, c.valid_until as due_at,
        h.id as holder_id, h.active as holder_active, h.site_id
      from external_certificates c
      join users h on h.id = c.holder_id
      where c.status = 'verified' and c.valid_until <= ${t} and c.valid_until > ${t} - interval '30 days'
        and ${latestOfKind}
        and exists (select 1 from authorisation_periods p join scope_requirements q on q.scope_id = p.scope_id and q.kind = 'certificate' and q.certificate_kind = c.kind
          where p.holder_id = c.holder_id and p.starts_at <= ${t} and p.ends_at > ${t})`, t),
  ];
  let n = 0;
  // One statement at a time: on a transaction's connection, statements cannot overlap.
  for (const statement of statements) n += ((await db.execute(statement)) as unknown as { rowCount: number | null }).rowCount ?? 0;
  return n;
}
