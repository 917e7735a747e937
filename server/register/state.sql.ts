import { sql, type SQL } from 'drizzle-orm';

/**
 * SQL that derives an authorisation's state at a moment, so registers can filter and page on it. It is
 * the same fold as foldState in server/authorisations/states.ts (tests/api/register.test.ts checks the two
 * agree at every instant of a scenario): the latest period begun by the moment, then its events that had
 * taken effect by then; "known" also leaves out what was recorded after the moment.
 */
export interface Moment {
  at: Date;
  known: boolean;
}

const ts = (m: Moment) => sql`${m.at.toISOString()}::timestamptz`;
const recorded = (alias: string, m: Moment) => (m.known ? sql.raw(` and ${alias}.recorded_at <= `).append(ts(m)) : sql``);

/**
 * `cross join lateral` the period (alias pe) of authorisation alias `a`. In the known view its end is the
 * one recorded by then: the old value of the first expiry change the audit trail holds after the moment.
 */
export function periodAt(m: Moment): SQL {
  const endsAt = m.known
    ? sql`coalesce((select (l.old_values->>'endsAt')::timestamptz from audit_log l
        where l.entity = 'authorisation_period' and l.entity_id = p.id::text and l.action = 'authorisation.expiry_changed' and l.at > ${ts(m)}
        order by l.id limit 1), p.ends_at)`
    : sql`p.ends_at`;
  return sql`cross join lateral (
    select p.id, p.starts_at, p.origin, ${endsAt} as ends_at from authorisation_periods p
    where p.authorisation_id = a.id and p.starts_at <= ${ts(m)} ${recorded('p', m)}
    order by p.starts_at desc limit 1) pe`;
}

/** `cross join lateral` the state and since (alias st) of period pe at the moment. */
export function stateAt(m: Moment): SQL {
  const at = ts(m);
  const upTo = (alias: string) => sql.raw(`${alias}.period_id = pe.id and ${alias}.effective_at <= `).append(at).append(recorded(alias, m));
  return sql`cross join lateral (
    select
      case when c.kind is not null then c.kind
           when ${at} >= pe.ends_at then 'lapsed'
           when h.n > 0 then case when h.waiting then 'renewal_submitted' else 'suspended' end
           else 'active' end as state,
      case when c.kind is not null then c.effective_at
           when ${at} >= pe.ends_at then pe.ends_at
           when h.n > 0 then h.since
           else coalesce(r.since, pe.starts_at) end as since
    from (select 1) one
    left join lateral (select e.kind, e.effective_at from authorisation_events e
      where ${upTo('e')} and e.kind in ('revoked', 'ended', 'lapsed') order by e.effective_at, e.recorded_at, e.id limit 1) c on true
    left join lateral (select count(*)::int as n, bool_and(x.cause like 'certificate:%' and x.renewal) as waiting, max(x.effective_at) as since
      from (select distinct on (e.cause) e.cause, e.kind, e.effective_at,
          exists (select 1 from authorisation_events rs where ${upTo('rs')} and rs.cause = e.cause and rs.kind = 'renewal_submitted'
            and (rs.effective_at, rs.recorded_at, rs.id) > (e.effective_at, e.recorded_at, e.id)) as renewal
        from authorisation_events e where ${upTo('e')} and e.kind in ('suspended', 'reinstated', 'restored')
        order by e.cause, e.effective_at desc, e.recorded_at desc, e.id desc) x
      where x.kind = 'suspended') h on true
    left join lateral (select max(e.effective_at) as since from authorisation_events e
      where ${upTo('e')} and e.kind in ('issued', 'renewed', 'reinstated', 'restored')) r on true
  ) st`;
}
