CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"entity" text NOT NULL,
	"entity_id" text NOT NULL,
	"record_label" text NOT NULL,
	"site_id" uuid,
	"severity" text NOT NULL,
	"status" text NOT NULL,
	"text" text NOT NULL,
	"raised_by" uuid NOT NULL,
	"raised_at" timestamp with time zone NOT NULL,
	"response" text,
	"answered_by" uuid,
	"answered_at" timestamp with time zone,
	"closing_note" text,
	"closed_by" uuid,
	"closed_at" timestamp with time zone,
	CONSTRAINT "findings_entity_ck" CHECK ("findings"."entity" in ('person', 'authorisation', 'procedure_version', 'practical', 'signoff', 'bench', 'bench_check', 'instrument', 'certificate', 'evidence', 'audit_entry')),
	CONSTRAINT "findings_severity_ck" CHECK ("findings"."severity" in ('observation', 'minor', 'major', 'critical')),
	CONSTRAINT "findings_status_ck" CHECK ("findings"."status" in ('open', 'answered', 'closed')),
	CONSTRAINT "findings_text_ck" CHECK (length("findings"."text") between 3 and 4000),
	CONSTRAINT "findings_answered_ck" CHECK (("findings"."response" is null) = ("findings"."answered_at" is null) and ("findings"."answered_at" is null) = ("findings"."answered_by" is null) and ("findings"."status" <> 'answered' or "findings"."response" is not null)),
	CONSTRAINT "findings_closed_ck" CHECK (("findings"."status" = 'closed') = ("findings"."closed_at" is not null) and ("findings"."closed_at" is null or ("findings"."closed_by" is not null and length("findings"."closing_note") >= 3)))
);
--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_raised_by_users_id_fk" FOREIGN KEY ("raised_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_answered_by_users_id_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_closed_by_users_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "findings_status_idx" ON "findings" USING btree ("status","raised_at");--> statement-breakpoint
CREATE INDEX "findings_site_idx" ON "findings" USING btree ("site_id","status","raised_at");--> statement-breakpoint
CREATE INDEX "findings_record_idx" ON "findings" USING btree ("entity","entity_id");