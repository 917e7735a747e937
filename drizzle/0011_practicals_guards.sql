-- Signed sign-offs and practicals never change: the database refuses it, whatever the code does. A
-- correction is a new row pointing at the old one. Only the lifecycle's own steps may update a row.
CREATE FUNCTION signoff_guard() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  review_cols text[] := array['status', 'reviewed_by', 'reviewed_at', 'review_signature_id', 'return_comment', 'updated_at'];
BEGIN
  IF OLD.status = 'in_progress' THEN
    IF (NEW.kind, NEW.person_id, NEW.site_id, NEW.procedure_id, NEW.version_id, NEW.checklist_id, NEW.bench_id, NEW.corrects_id, NEW.correction_reason, NEW.created_at)
       IS DISTINCT FROM (OLD.kind, OLD.person_id, OLD.site_id, OLD.procedure_id, OLD.version_id, OLD.checklist_id, OLD.bench_id, OLD.corrects_id, OLD.correction_reason, OLD.created_at)
       OR NEW.status NOT IN ('in_progress', 'submitted', 'recorded') THEN
      RAISE EXCEPTION 'sign-off %: what it is about cannot change', OLD.id USING ERRCODE = 'integrity_constraint_violation';
    END IF;
    RETURN NEW;
  END IF;
  IF OLD.status = 'submitted' AND NEW.status IN ('countersigned', 'returned') AND (to_jsonb(NEW) - review_cols) = (to_jsonb(OLD) - review_cols) THEN
    RETURN NEW;
  END IF;
  RAISE EXCEPTION 'sign-off % is signed (%) and never changes; record a correction instead', OLD.id, OLD.status USING ERRCODE = 'integrity_constraint_violation';
END
$$;
--> statement-breakpoint
CREATE TRIGGER signoffs_guard BEFORE UPDATE ON signoffs FOR EACH ROW EXECUTE FUNCTION signoff_guard();
--> statement-breakpoint
CREATE FUNCTION practical_guard() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  ack_cols text[] := array['status', 'acknowledged_at', 'technician_signature_id', 'updated_at'];
BEGIN
  IF OLD.status = 'in_progress' THEN
    IF (NEW.technician_id, NEW.assessor_id, NEW.site_id, NEW.bench_id, NEW.procedure_id, NEW.version_id, NEW.checklist_id, NEW.scope_id, NEW.circuit, NEW.expectations, NEW.held_at, NEW.created_at, NEW.corrects_id, NEW.correction_reason)
       IS DISTINCT FROM (OLD.technician_id, OLD.assessor_id, OLD.site_id, OLD.bench_id, OLD.procedure_id, OLD.version_id, OLD.checklist_id, OLD.scope_id, OLD.circuit, OLD.expectations, OLD.held_at, OLD.created_at, OLD.corrects_id, OLD.correction_reason)
       OR NEW.status NOT IN ('in_progress', 'assessed') OR NOT (OLD.instrument_ids <@ NEW.instrument_ids) THEN
      RAISE EXCEPTION 'practical %: the circuit, the people and the bench cannot change', OLD.id USING ERRCODE = 'integrity_constraint_violation';
    END IF;
    RETURN NEW;
  END IF;
  IF OLD.status = 'assessed' AND NEW.status = 'acknowledged' AND (to_jsonb(NEW) - ack_cols) = (to_jsonb(OLD) - ack_cols) THEN
    RETURN NEW;
  END IF;
  RAISE EXCEPTION 'practical % is signed (%) and never changes; record a correction instead', OLD.id, OLD.status USING ERRCODE = 'integrity_constraint_violation';
END
$$;
--> statement-breakpoint
CREATE TRIGGER practicals_guard BEFORE UPDATE ON practicals FOR EACH ROW EXECUTE FUNCTION practical_guard();
--> statement-breakpoint
-- Entries and witnessed hold points may be written only while their record is being filled in.
CREATE FUNCTION record_entry_guard() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  parent_status text;
BEGIN
  IF TG_TABLE_NAME = 'signoff_entries' THEN
    SELECT status INTO parent_status FROM signoffs WHERE id = NEW.signoff_id;
  ELSE
    SELECT status INTO parent_status FROM practicals WHERE id = NEW.practical_id;
  END IF;
  IF parent_status IS DISTINCT FROM 'in_progress' THEN
    RAISE EXCEPTION '% refused on %: the record is signed (%)', TG_OP, TG_TABLE_NAME, parent_status USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  IF TG_OP = 'UPDATE' AND TG_TABLE_NAME = 'practical_hold_points' THEN
    RAISE EXCEPTION 'a witnessed hold point is not re-witnessed' USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN NEW;
END
$$;
--> statement-breakpoint
CREATE TRIGGER signoff_entries_guard BEFORE INSERT OR UPDATE ON signoff_entries FOR EACH ROW EXECUTE FUNCTION record_entry_guard();
--> statement-breakpoint
CREATE TRIGGER practical_entries_guard BEFORE INSERT OR UPDATE ON practical_entries FOR EACH ROW EXECUTE FUNCTION record_entry_guard();
--> statement-breakpoint
CREATE TRIGGER practical_hold_points_guard BEFORE INSERT OR UPDATE ON practical_hold_points FOR EACH ROW EXECUTE FUNCTION record_entry_guard();
--> statement-breakpoint
-- A hold point is one of the version's hold-point steps, and none before it may be left unwitnessed.
CREATE FUNCTION hold_point_order_guard() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF NOT EXISTS (
    SELECT 1 FROM practicals p JOIN procedure_steps s ON s.version_id = p.version_id
    WHERE p.id = NEW.practical_id AND s.key = NEW.step_key AND s.position = NEW.position AND s.hold_point
  ) THEN
    RAISE EXCEPTION 'step % is not a hold point of the practical''s procedure version', NEW.step_key USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  IF EXISTS (
    SELECT 1 FROM practicals p JOIN procedure_steps s ON s.version_id = p.version_id
    WHERE p.id = NEW.practical_id AND s.hold_point AND s.position < NEW.position
      AND NOT EXISTS (SELECT 1 FROM practical_hold_points h WHERE h.practical_id = NEW.practical_id AND h.step_key = s.key)
  ) THEN
    RAISE EXCEPTION 'an earlier hold point of practical % is not witnessed yet', NEW.practical_id USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN NEW;
END
$$;
--> statement-breakpoint
CREATE TRIGGER practical_hold_points_order BEFORE INSERT ON practical_hold_points FOR EACH ROW EXECUTE FUNCTION hold_point_order_guard();
--> statement-breakpoint
REVOKE DELETE, TRUNCATE ON signoffs, signoff_entries, practicals, practical_entries, practical_hold_points FROM breakover_app;
