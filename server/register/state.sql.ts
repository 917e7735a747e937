import { sql, type SQL } from 'drizzle-orm';

/**
 * Where the register reads an authorisation's state at a moment (tests/api/register.test.ts checks it against
 * stateAt, the authorisations feature's own fold, at every instant of a scenario):
 * - "effective": the state spans the database keeps from the periods and their events (drizzle/0015), found
 *   through their btree indexes on the span's bounds: every event in effect by the moment, whenever it was recorded;
 * - "known": only what had been recorded by the moment, folded per row by the same SQL function the spans
 *   are built with, and each period's end as recorded then (the old value of the first later expiry change).
 */
export interface Moment {
  at: Date;
  known: boolean;
}

const ts = (m: Moment) => sql`${m.at.toISOString()}::timestamptz`;

/** The span of alias st contains the moment, written over its bound columns so the btree indexes answer it. */
export const spanHolds = (at: Date) => sql`st.to_at > ${at.toISOString()}::timestamptz and st.from_at <= ${at.toISOString()}::timestamptz`;

/** Joins, for authorisation alias `a`, its period at the moment (alias pe: id, starts_at, origin, ends_at) and state then (alias st: state, since). */
export function stateSource(m: Moment): SQL {
  if (!m.known) {
    return sql`join authorisation_state_spans st on st.authorisation_id = a.id and ${spanHolds(m.at)}
      join authorisation_periods pe on pe.id = st.period_id`;
  }
  return sql`cross join lateral (
      select p.id, p.starts_at, p.origin, coalesce((select (l.old_values->>'endsAt')::timestamptz from audit_log l
          where l.entity = 'authorisation_period' and l.entity_id = p.id::text and l.action = 'authorisation.expiry_changed' and l.at > ${ts(m)}
          order by l.id limit 1), p.ends_at) as ends_at
      from authorisation_periods p
      where p.authorisation_id = a.id and p.starts_at <= ${ts(m)} and p.recorded_at <= ${ts(m)}
      order by p.starts_at desc limit 1) pe
    cross join lateral authorisation_state_at(pe.id, pe.starts_at, pe.ends_at, ${ts(m)}, true) st`;
}
