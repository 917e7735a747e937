-- The state of one period at a moment: the same fold as foldState (server/authorisations/states.ts). The latest
-- closing event in effect decides (revoked, ended, lapsed); past its end it has lapsed; open holds (the last
-- suspend/reinstate/restore per cause is a suspension) make it suspended, or "renewal submitted" when every
-- hold is a certificate with a renewal submitted since; otherwise it is in force. "known" also leaves out
-- events recorded after the moment.
CREATE FUNCTION authorisation_state_at(p_period uuid, p_starts timestamptz, p_ends timestamptz, p_at timestamptz, p_known boolean)
RETURNS TABLE (state text, since timestamptz) LANGUAGE sql STABLE AS $$
  select
    case when c.kind is not null then c.kind
         when p_at >= p_ends then 'lapsed'
         when h.n > 0 then case when h.waiting then 'renewal_submitted' else 'suspended' end
         else 'active' end,
    case when c.kind is not null then c.effective_at
         when p_at >= p_ends then p_ends
         when h.n > 0 then h.since
         else coalesce(r.since, p_starts) end
  from (select 1) one
  left join lateral (select e.kind, e.effective_at from authorisation_events e
    where e.period_id = p_period and e.effective_at <= p_at and (not p_known or e.recorded_at <= p_at) and e.kind in ('revoked', 'ended', 'lapsed')
    order by e.effective_at, e.recorded_at, e.id limit 1) c on true
  left join lateral (select count(*)::int as n, bool_and(x.cause like 'certificate:%' and x.renewal) as waiting, max(x.effective_at) as since
    from (select distinct on (e.cause) e.cause, e.kind, e.effective_at,
        exists (select 1 from authorisation_events rs where rs.period_id = p_period and rs.effective_at <= p_at and (not p_known or rs.recorded_at <= p_at)
          and rs.cause = e.cause and rs.kind = 'renewal_submitted' and (rs.effective_at, rs.recorded_at, rs.id) > (e.effective_at, e.recorded_at, e.id)) as renewal
      from authorisation_events e
      where e.period_id = p_period and e.effective_at <= p_at and (not p_known or e.recorded_at <= p_at) and e.kind in ('suspended', 'reinstated', 'restored')
      order by e.cause, e.effective_at desc, e.recorded_at desc, e.id desc) x
    where x.kind = 'suspended') h on true
  left join lateral (select max(e.effective_at) as since from authorisation_events e
    where e.period_id = p_period and e.effective_at <= p_at and (not p_known or e.recorded_at <= p_at) and e.kind in ('issued', 'renewed', 'reinstated', 'restored')) r on true
$$;
--> statement-breakpoint
-- Rewrites the spans of the given authorisations: for each period, from its start to the next period's start
-- (or for ever), one span between each pair of moments where something changes (its start, its events, its end).
CREATE FUNCTION authorisation_spans_rebuild(ids uuid[]) RETURNS void LANGUAGE sql SECURITY DEFINER SET search_path = public AS $$
  delete from authorisation_state_spans where authorisation_id = any(ids);
  insert into authorisation_state_spans (period_id, authorisation_id, holder_id, scope_id, state, since, span)
  select p.id, p.authorisation_id, p.holder_id, p.scope_id, st.state, st.since, tstzrange(b.t, b.next, '[)')
  from authorisation_periods p
  cross join lateral (select coalesce((select min(n.starts_at) from authorisation_periods n
    where n.authorisation_id = p.authorisation_id and n.starts_at > p.starts_at), 'infinity'::timestamptz) as upto) nx
  cross join lateral (
    select pts.t, coalesce(lead(pts.t) over (order by pts.t), nx.upto) as next
    from (select p.starts_at as t
          union select greatest(e.effective_at, p.starts_at) from authorisation_events e where e.period_id = p.id
          union select p.ends_at) pts
    where pts.t < nx.upto) b
  cross join lateral authorisation_state_at(p.id, p.starts_at, p.ends_at, b.t, false) st
  where p.authorisation_id = any(ids);
$$;
--> statement-breakpoint
CREATE FUNCTION authorisation_spans_after_events() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
BEGIN
  PERFORM authorisation_spans_rebuild(array(select distinct p.authorisation_id from new_rows n join authorisation_periods p on p.id = n.period_id));
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE FUNCTION authorisation_spans_after_periods() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
BEGIN
  PERFORM authorisation_spans_rebuild(array(select distinct authorisation_id from new_rows));
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER authorisation_events_spans AFTER INSERT ON authorisation_events
  REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION authorisation_spans_after_events();
--> statement-breakpoint
CREATE TRIGGER authorisation_periods_spans_inserted AFTER INSERT ON authorisation_periods
  REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION authorisation_spans_after_periods();
--> statement-breakpoint
CREATE TRIGGER authorisation_periods_spans_updated AFTER UPDATE ON authorisation_periods
  REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION authorisation_spans_after_periods();
--> statement-breakpoint
-- Only the database writes spans; the application reads them.
REVOKE INSERT, UPDATE, DELETE, TRUNCATE ON authorisation_state_spans FROM breakover_app;
--> statement-breakpoint
SELECT authorisation_spans_rebuild(array(select id from authorisations));
