CREATE TABLE "audit_seal" (
	"entry_id" bigint PRIMARY KEY NOT NULL,
	"prev_id" bigint NOT NULL,
	"hmac" text NOT NULL,
	"sealed_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
ALTER TABLE "audit_log" ALTER COLUMN "id" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "audit_log" ADD COLUMN "tx" "xid8";--> statement-breakpoint
ALTER TABLE "audit_seal" ADD CONSTRAINT "audit_seal_entry_id_audit_log_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."audit_log"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "audit_seal_prev_uq" ON "audit_seal" USING btree ("prev_id");