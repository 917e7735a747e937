-- btree_gist lets one exclusion constraint compare uuids for equality and ranges for overlap.
CREATE EXTENSION IF NOT EXISTS btree_gist;
--> statement-breakpoint
-- One person never holds two overlapping periods of one scope, whatever the code does.
ALTER TABLE authorisation_periods ADD CONSTRAINT authorisation_periods_no_overlap
  EXCLUDE USING gist (holder_id WITH =, scope_id WITH =, during WITH &&);
--> statement-breakpoint
-- "Who held what at moment t" over every holder: the register at a past moment.
CREATE INDEX authorisation_periods_during_idx ON authorisation_periods USING gist (during);
--> statement-breakpoint
-- Events are history: the application may add them, never change or remove them.
REVOKE UPDATE, DELETE, TRUNCATE ON authorisation_events FROM breakover_app;
--> statement-breakpoint
CREATE FUNCTION authorisation_events_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'authorisation_events is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
END
$$;
--> statement-breakpoint
CREATE TRIGGER authorisation_events_no_update_delete BEFORE UPDATE OR DELETE ON authorisation_events
  FOR EACH ROW EXECUTE FUNCTION authorisation_events_refuse_change();
