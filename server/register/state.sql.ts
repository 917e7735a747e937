import { sql, type SQL } from 'drizzle-orm';

/**
 * Where the register reads an authorisation's state at a moment (tests/api/register.test.ts checks it against
 * stateAt, the authorisations feature's own fold, at every instant of a scenario):
 * - "effective": the state spans the database keeps from the periods and their events (drizzle/0015), found
 *   through their btree indexes on the span's bounds: every event in effect by the moment, whenever it was recorded;
 * - "known": only what had been recorded by the moment, and each period's end as recorded then (the old
 *   value of the first later expiry change): folded per row, by the same SQL function the spans are built
 *   with, for the few authorisations something was recorded about afterwards; the spans for the rest.
 */
export interface Moment {
  at: Date;
  known: boolean;
}

const ts = (m: Moment) => sql`${m.at.toISOString()}::timestamptz`;

/** The span of alias st contains the moment, written over its bound columns so the btree indexes answer it. */
export const spanHolds = (at: Date) => sql`st.to_at > ${at.toISOString()}::timestamptz and st.from_at <= ${at.toISOString()}::timestamptz`;

/**
 * Authorisations whose reading "as recorded then" may differ from the spans at `at`: a period begun by then
 * but entered later (a paper record), an event in effect by then but recorded later (a lapse the sweep
 * noted afterwards), or an end moved after then. Only these are folded row by row; for every other one the
 * two readings agree and the spans answer. Each arm reads a small partial or action index.
 */
export function revisedSince(at: Date): SQL {
  const t = sql`${at.toISOString()}::timestamptz`;
  return sql`select distinct x.authorisation_id from (
      select p.authorisation_id from authorisation_periods p where p.recorded_at > p.starts_at and p.recorded_at > ${t} and p.starts_at <= ${t}
      union all
      select p.authorisation_id from authorisation_events e join authorisation_periods p on p.id = e.period_id
        where e.recorded_at > e.effective_at and e.recorded_at > ${t} and e.effective_at <= ${t}
      union all
      select p.authorisation_id from audit_log l join authorisation_periods p on p.id = l.entity_id::uuid
        where l.action = 'authorisation.expiry_changed' and l.entity = 'authorisation_period' and l.at > ${t} and p.starts_at <= ${t}) x`;
}

/** Joins, for authorisation alias `a`, its period at the moment (alias pe: id, starts_at, origin, ends_at) and state then (alias st: state, since). */
export function stateSource(m: Moment): SQL {
  if (!m.known) {
    return sql`join authorisation_state_spans st on st.authorisation_id = a.id and ${spanHolds(m.at)}
      join authorisation_periods pe on pe.id = st.period_id`;
  }
  return sql`left join (${revisedSince(m.at)}) rv on rv.authorisation_id = a.id
    cross join lateral (
      select sp.period_id as id, p.starts_at, p.origin, p.ends_at, sp.state, sp.since
      from authorisation_state_spans sp join authorisation_periods p on p.id = sp.period_id
      where rv.authorisation_id is null and sp.authorisation_id = a.id and sp.to_at > ${ts(m)} and sp.from_at <= ${ts(m)}
      union all
      select k.id, k.starts_at, k.origin, k.ends_at, f.state, f.since from (
        select p.id, p.starts_at, p.origin, coalesce((select (l.old_values->>'endsAt')::timestamptz from audit_log l
            where l.entity = 'authorisation_period' and l.entity_id = p.id::text and l.action = 'authorisation.expiry_changed' and l.at > ${ts(m)}
            order by l.id limit 1), p.ends_at) as ends_at
        from authorisation_periods p
        where rv.authorisation_id is not null and p.authorisation_id = a.id and p.starts_at <= ${ts(m)} and p.recorded_at <= ${ts(m)}
        order by p.starts_at desc limit 1) k
      cross join lateral authorisation_state_at(k.id, k.starts_at, k.ends_at, ${ts(m)}, true) f) pe
    cross join lateral (select pe.state, pe.since) st`;
}
