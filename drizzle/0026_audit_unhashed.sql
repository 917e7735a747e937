DROP INDEX "audit_log_hash_uq";--> statement-breakpoint
DROP INDEX "audit_log_prev_hash_uq";--> statement-breakpoint
ALTER TABLE "audit_log" DROP COLUMN "prev_hash";--> statement-breakpoint
ALTER TABLE "audit_log" DROP COLUMN "hash";--> statement-breakpoint
-- Entries are only appended now; the chain lives in audit_seal, written after commit by the sealer.
-- The writer's transaction id is taken before its sequence number, so any transaction holding a number
-- already had its transaction id: the sealer waits for those to finish before sealing up to that number.
ALTER TABLE "audit_log" ALTER COLUMN "id" DROP DEFAULT;
--> statement-breakpoint
CREATE FUNCTION audit_log_stamp() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  NEW.tx := pg_current_xact_id();
  NEW.id := nextval('audit_log_id_seq');
  RETURN NEW;
END
$$;
--> statement-breakpoint
CREATE TRIGGER audit_log_stamp BEFORE INSERT ON audit_log FOR EACH ROW EXECUTE FUNCTION audit_log_stamp();
--> statement-breakpoint
REVOKE UPDATE, DELETE, TRUNCATE ON audit_seal FROM breakover_app;
--> statement-breakpoint
CREATE FUNCTION append_only_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
END
$$;
--> statement-breakpoint
CREATE TRIGGER audit_seal_no_update_delete BEFORE UPDATE OR DELETE ON audit_seal
  FOR EACH ROW EXECUTE FUNCTION append_only_refuse_change();
--> statement-breakpoint
CREATE TRIGGER audit_seal_no_truncate BEFORE TRUNCATE ON audit_seal
  FOR EACH STATEMENT EXECUTE FUNCTION append_only_refuse_change();
