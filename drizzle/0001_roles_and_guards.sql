-- The application connects through this role (SET ROLE at connect), so that what it may do to the
-- audit trail is limited by the database itself, not by the code.
DO $$
BEGIN
  IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = 'breakover_app') THEN
    CREATE ROLE breakover_app NOLOGIN;
  END IF;
END
$$;
--> statement-breakpoint
GRANT breakover_app TO CURRENT_USER;
--> statement-breakpoint
GRANT USAGE ON SCHEMA public TO breakover_app;
--> statement-breakpoint
GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO breakover_app;
--> statement-breakpoint
GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO breakover_app;
--> statement-breakpoint
ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO breakover_app;
--> statement-breakpoint
ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT USAGE, SELECT ON SEQUENCES TO breakover_app;
--> statement-breakpoint
REVOKE UPDATE, DELETE, TRUNCATE ON audit_log FROM breakover_app;
--> statement-breakpoint
CREATE FUNCTION audit_log_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'audit_log is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
END
$$;
--> statement-breakpoint
CREATE TRIGGER audit_log_no_update_delete BEFORE UPDATE OR DELETE ON audit_log
  FOR EACH ROW EXECUTE FUNCTION audit_log_refuse_change();
--> statement-breakpoint
CREATE TRIGGER audit_log_no_truncate BEFORE TRUNCATE ON audit_log
  FOR EACH STATEMENT EXECUTE FUNCTION audit_log_refuse_change();
--> statement-breakpoint
-- connect-pg-simple's own table (its table.sql), created here so the app role never needs CREATE.
CREATE TABLE "session" (
  "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
  "sess" json NOT NULL,
  "expire" timestamp(6) NOT NULL
);
--> statement-breakpoint
CREATE INDEX "IDX_session_expire" ON "session" ("expire");
--> statement-breakpoint
GRANT SELECT, INSERT, UPDATE, DELETE ON "session" TO breakover_app;
