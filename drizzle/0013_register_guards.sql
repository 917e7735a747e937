-- The audit trail view filters by action ("authorisation.revoked", or every "authorisation." one) over a long trail.
CREATE INDEX audit_log_action_idx ON audit_log (action text_pattern_ops, at);
--> statement-breakpoint
-- A finding is a record of the audit: it is answered and closed, never removed.
REVOKE DELETE, TRUNCATE ON findings FROM breakover_app;
--> statement-breakpoint
CREATE FUNCTION findings_refuse_reopen() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.status = 'closed' THEN
    RAISE EXCEPTION 'finding % is closed and cannot change', OLD.id USING ERRCODE = 'insufficient_privilege';
  END IF;
  IF NEW.entity <> OLD.entity OR NEW.entity_id <> OLD.entity_id OR NEW.text <> OLD.text OR NEW.raised_by <> OLD.raised_by OR NEW.raised_at <> OLD.raised_at THEN
    RAISE EXCEPTION 'what a finding says and whom it is about cannot change' USING ERRCODE = 'insufficient_privilege';
  END IF;
  RETURN NEW;
END
$$;
--> statement-breakpoint
CREATE TRIGGER findings_guard BEFORE UPDATE ON findings FOR EACH ROW EXECUTE FUNCTION findings_refuse_reopen();
