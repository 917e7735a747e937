-- Document control held by the database itself: only the lifecycle's own transitions, and nothing in a
-- version that has left the draft state changes (its steps, checklists and items included).
CREATE FUNCTION procedure_version_guard() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF NEW.status IS DISTINCT FROM OLD.status AND (OLD.status, NEW.status) NOT IN (
    ('draft', 'in_review'), ('in_review', 'draft'), ('in_review', 'published'), ('published', 'superseded'), ('published', 'withdrawn')
  ) THEN
    RAISE EXCEPTION 'procedure version % may not go from % to %', OLD.id, OLD.status, NEW.status USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  IF OLD.status <> 'draft' AND (
    NEW.procedure_id, NEW.number, NEW.based_on_id, NEW.title, NEW.category, NEW.review_period_months, NEW.scope, NEW.hazards,
    NEW.ppe, NEW.equipment, NEW.change_class, NEW.change_summary, NEW.reread_days, NEW.author_id, NEW.editor_ids
  ) IS DISTINCT FROM (
    OLD.procedure_id, OLD.number, OLD.based_on_id, OLD.title, OLD.category, OLD.review_period_months, OLD.scope, OLD.hazards,
    OLD.ppe, OLD.equipment, OLD.change_class, OLD.change_summary, OLD.reread_days, OLD.author_id, OLD.editor_ids
  ) THEN
    RAISE EXCEPTION 'procedure version % is % and its content cannot change', OLD.id, OLD.status USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN NEW;
END
$$;
--> statement-breakpoint
CREATE TRIGGER procedure_versions_guard BEFORE UPDATE ON procedure_versions
  FOR EACH ROW EXECUTE FUNCTION procedure_version_guard();
--> statement-breakpoint
CREATE FUNCTION procedure_content_guard() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  v_id uuid;
  v_status text;
BEGIN
  IF TG_TABLE_NAME = 'checklist_items' THEN
    SELECT c.version_id INTO v_id FROM procedure_checklists c
      WHERE c.id = CASE WHEN TG_OP = 'DELETE' THEN OLD.checklist_id ELSE NEW.checklist_id END;
  ELSE
    v_id := CASE WHEN TG_OP = 'DELETE' THEN OLD.version_id ELSE NEW.version_id END;
  END IF;
  SELECT status INTO v_status FROM procedure_versions WHERE id = v_id;
  -- A checklist deleted together with its items has already gone: nothing left to protect.
  IF v_status IS NOT NULL AND v_status <> 'draft' THEN
    RAISE EXCEPTION '% of procedure version % refused: the version is %', TG_OP, v_id, v_status USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END
$$;
--> statement-breakpoint
CREATE TRIGGER procedure_steps_guard BEFORE INSERT OR UPDATE OR DELETE ON procedure_steps
  FOR EACH ROW EXECUTE FUNCTION procedure_content_guard();
--> statement-breakpoint
CREATE TRIGGER procedure_checklists_guard BEFORE INSERT OR UPDATE OR DELETE ON procedure_checklists
  FOR EACH ROW EXECUTE FUNCTION procedure_content_guard();
--> statement-breakpoint
CREATE TRIGGER checklist_items_guard BEFORE INSERT OR UPDATE OR DELETE ON checklist_items
  FOR EACH ROW EXECUTE FUNCTION procedure_content_guard();
--> statement-breakpoint
-- Signed records are kept: the application may add and read them, never rewrite or remove them.
REVOKE UPDATE, DELETE, TRUNCATE ON procedure_acknowledgements FROM breakover_app;
