CREATE TABLE "practical_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"practical_id" uuid NOT NULL,
	"item_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"checked" boolean,
	"text" text,
	"evidence_id" uuid,
	"value" double precision,
	"did_not_trip" boolean DEFAULT false NOT NULL,
	"unit" text,
	"instrument_id" uuid,
	"expected" double precision,
	"tolerance" text,
	"verdict" text,
	"judged_by" text,
	"rule_text" text,
	"source" jsonb,
	"note" text,
	"recorded_at" timestamp with time zone NOT NULL,
	"recorded_by" uuid NOT NULL,
	CONSTRAINT "practical_entries_kind_ck" CHECK ("practical_entries"."kind" in ('tick', 'text', 'evidence', 'measurement')),
	CONSTRAINT "practical_entries_verdict_ck" CHECK (("practical_entries"."verdict" is null or "practical_entries"."verdict" in ('pass', 'fail')) and ("practical_entries"."judged_by" is null or "practical_entries"."judged_by" in ('rule', 'assessor'))),
	CONSTRAINT "practical_entries_measured_ck" CHECK ("practical_entries"."kind" <> 'measurement' or (("practical_entries"."value" is not null) <> "practical_entries"."did_not_trip" and "practical_entries"."unit" is not null)),
	CONSTRAINT "practical_entries_instrument_ck" CHECK ("practical_entries"."kind" <> 'measurement' or "practical_entries"."instrument_id" is not null)
);
--> statement-breakpoint
CREATE TABLE "practical_hold_points" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"practical_id" uuid NOT NULL,
	"step_key" uuid NOT NULL,
	"position" integer NOT NULL,
	"witnessed_at" timestamp with time zone NOT NULL,
	"witnessed_by" uuid NOT NULL,
	"note" text
);
--> statement-breakpoint
CREATE TABLE "practicals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"technician_id" uuid NOT NULL,
	"assessor_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"bench_id" uuid NOT NULL,
	"procedure_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"checklist_id" uuid NOT NULL,
	"scope_id" uuid,
	"instrument_ids" uuid[] NOT NULL,
	"circuit" jsonb NOT NULL,
	"expectations" jsonb NOT NULL,
	"status" text NOT NULL,
	"outcome" text,
	"outcome_comment" text,
	"held_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone NOT NULL,
	"assessed_at" timestamp with time zone,
	"assessor_signature_id" uuid,
	"acknowledged_at" timestamp with time zone,
	"technician_signature_id" uuid,
	"corrects_id" uuid,
	"correction_reason" text,
	CONSTRAINT "practicals_not_self_ck" CHECK ("practicals"."technician_id" <> "practicals"."assessor_id"),
	CONSTRAINT "practicals_status_ck" CHECK ("practicals"."status" in ('in_progress', 'assessed', 'acknowledged')),
	CONSTRAINT "practicals_outcome_ck" CHECK ("practicals"."outcome" is null or "practicals"."outcome" in ('competent', 'not_yet_competent')),
	CONSTRAINT "practicals_assessed_ck" CHECK ("practicals"."status" = 'in_progress' or ("practicals"."outcome" is not null and length("practicals"."outcome_comment") >= 3 and "practicals"."assessed_at" is not null and "practicals"."assessor_signature_id" is not null)),
	CONSTRAINT "practicals_acknowledged_ck" CHECK (("practicals"."status" = 'acknowledged') = ("practicals"."technician_signature_id" is not null and "practicals"."acknowledged_at" is not null)),
	CONSTRAINT "practicals_correction_ck" CHECK (("practicals"."corrects_id" is null) = ("practicals"."correction_reason" is null) and "practicals"."corrects_id" is distinct from "practicals"."id")
);
--> statement-breakpoint
CREATE TABLE "signoff_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"signoff_id" uuid NOT NULL,
	"item_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"checked" boolean,
	"text" text,
	"evidence_id" uuid,
	"value" double precision,
	"did_not_trip" boolean DEFAULT false NOT NULL,
	"unit" text,
	"instrument_id" uuid,
	"expected" double precision,
	"tolerance" text,
	"verdict" text,
	"judged_by" text,
	"rule_text" text,
	"source" jsonb,
	"note" text,
	"recorded_at" timestamp with time zone NOT NULL,
	"recorded_by" uuid NOT NULL,
	CONSTRAINT "signoff_entries_kind_ck" CHECK ("signoff_entries"."kind" in ('tick', 'text', 'evidence', 'measurement')),
	CONSTRAINT "signoff_entries_verdict_ck" CHECK (("signoff_entries"."verdict" is null or "signoff_entries"."verdict" in ('pass', 'fail')) and ("signoff_entries"."judged_by" is null or "signoff_entries"."judged_by" in ('rule', 'assessor'))),
	CONSTRAINT "signoff_entries_measured_ck" CHECK ("signoff_entries"."kind" <> 'measurement' or (("signoff_entries"."value" is not null) <> "signoff_entries"."did_not_trip" and "signoff_entries"."unit" is not null))
);
--> statement-breakpoint
CREATE TABLE "signoffs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kind" text NOT NULL,
	"person_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"procedure_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"checklist_id" uuid NOT NULL,
	"bench_id" uuid,
	"status" text NOT NULL,
	"corrects_id" uuid,
	"correction_reason" text,
	"created_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone NOT NULL,
	"submitted_at" timestamp with time zone,
	"submit_signature_id" uuid,
	"passed" boolean,
	"notes" text,
	"bench_check_id" uuid,
	"reviewed_by" uuid,
	"reviewed_at" timestamp with time zone,
	"review_signature_id" uuid,
	"return_comment" text,
	CONSTRAINT "signoffs_kind_ck" CHECK ("signoffs"."kind" in ('self-sign-off', 'bench-pre-use')),
	CONSTRAINT "signoffs_status_ck" CHECK ("signoffs"."status" in ('in_progress', 'submitted', 'countersigned', 'returned', 'recorded')),
	CONSTRAINT "signoffs_bench_ck" CHECK (("signoffs"."kind" = 'bench-pre-use') = ("signoffs"."bench_id" is not null)),
	CONSTRAINT "signoffs_recorded_ck" CHECK (("signoffs"."status" = 'recorded') = ("signoffs"."kind" = 'bench-pre-use' and "signoffs"."status" <> 'in_progress') and ("signoffs"."status" <> 'recorded' or ("signoffs"."passed" is not null and "signoffs"."bench_check_id" is not null))),
	CONSTRAINT "signoffs_signed_ck" CHECK ("signoffs"."status" = 'in_progress' or ("signoffs"."submitted_at" is not null and "signoffs"."submit_signature_id" is not null)),
	CONSTRAINT "signoffs_reviewed_ck" CHECK ("signoffs"."status" not in ('countersigned', 'returned') or ("signoffs"."reviewed_by" is not null and "signoffs"."reviewed_at" is not null and "signoffs"."reviewed_by" <> "signoffs"."person_id")),
	CONSTRAINT "signoffs_countersigned_ck" CHECK ("signoffs"."status" <> 'countersigned' or "signoffs"."review_signature_id" is not null),
	CONSTRAINT "signoffs_returned_ck" CHECK ("signoffs"."status" <> 'returned' or length("signoffs"."return_comment") >= 3),
	CONSTRAINT "signoffs_correction_ck" CHECK (("signoffs"."corrects_id" is null) = ("signoffs"."correction_reason" is null) and "signoffs"."corrects_id" is distinct from "signoffs"."id")
);
--> statement-breakpoint
ALTER TABLE "practical_entries" ADD CONSTRAINT "practical_entries_practical_id_practicals_id_fk" FOREIGN KEY ("practical_id") REFERENCES "public"."practicals"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_entries" ADD CONSTRAINT "practical_entries_item_id_checklist_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."checklist_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_entries" ADD CONSTRAINT "practical_entries_evidence_id_evidence_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_entries" ADD CONSTRAINT "practical_entries_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_entries" ADD CONSTRAINT "practical_entries_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_hold_points" ADD CONSTRAINT "practical_hold_points_practical_id_practicals_id_fk" FOREIGN KEY ("practical_id") REFERENCES "public"."practicals"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_hold_points" ADD CONSTRAINT "practical_hold_points_witnessed_by_users_id_fk" FOREIGN KEY ("witnessed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_assessor_id_users_id_fk" FOREIGN KEY ("assessor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_bench_id_benches_id_fk" FOREIGN KEY ("bench_id") REFERENCES "public"."benches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_procedure_id_procedures_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_version_id_procedure_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_checklist_id_procedure_checklists_id_fk" FOREIGN KEY ("checklist_id") REFERENCES "public"."procedure_checklists"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_scope_id_scopes_id_fk" FOREIGN KEY ("scope_id") REFERENCES "public"."scopes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_assessor_signature_id_signatures_id_fk" FOREIGN KEY ("assessor_signature_id") REFERENCES "public"."signatures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_technician_signature_id_signatures_id_fk" FOREIGN KEY ("technician_signature_id") REFERENCES "public"."signatures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_corrects_id_practicals_id_fk" FOREIGN KEY ("corrects_id") REFERENCES "public"."practicals"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoff_entries" ADD CONSTRAINT "signoff_entries_signoff_id_signoffs_id_fk" FOREIGN KEY ("signoff_id") REFERENCES "public"."signoffs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoff_entries" ADD CONSTRAINT "signoff_entries_item_id_checklist_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."checklist_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoff_entries" ADD CONSTRAINT "signoff_entries_evidence_id_evidence_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoff_entries" ADD CONSTRAINT "signoff_entries_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoff_entries" ADD CONSTRAINT "signoff_entries_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_person_id_users_id_fk" FOREIGN KEY ("person_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_procedure_id_procedures_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_version_id_procedure_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_checklist_id_procedure_checklists_id_fk" FOREIGN KEY ("checklist_id") REFERENCES "public"."procedure_checklists"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_bench_id_benches_id_fk" FOREIGN KEY ("bench_id") REFERENCES "public"."benches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_corrects_id_signoffs_id_fk" FOREIGN KEY ("corrects_id") REFERENCES "public"."signoffs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_submit_signature_id_signatures_id_fk" FOREIGN KEY ("submit_signature_id") REFERENCES "public"."signatures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_reviewed_by_users_id_fk" FOREIGN KEY ("reviewed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signoffs" ADD CONSTRAINT "signoffs_review_signature_id_signatures_id_fk" FOREIGN KEY ("review_signature_id") REFERENCES "public"."signatures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "practical_entries_item_uq" ON "practical_entries" USING btree ("practical_id","item_id");--> statement-breakpoint
CREATE UNIQUE INDEX "practical_hold_points_step_uq" ON "practical_hold_points" USING btree ("practical_id","step_key");--> statement-breakpoint
CREATE UNIQUE INDEX "practical_hold_points_position_uq" ON "practical_hold_points" USING btree ("practical_id","position");--> statement-breakpoint
CREATE INDEX "practicals_technician_idx" ON "practicals" USING btree ("technician_id","held_at");--> statement-breakpoint
CREATE INDEX "practicals_assessor_idx" ON "practicals" USING btree ("assessor_id","held_at");--> statement-breakpoint
CREATE INDEX "practicals_site_idx" ON "practicals" USING btree ("site_id","status","held_at");--> statement-breakpoint
CREATE INDEX "practicals_bench_idx" ON "practicals" USING btree ("bench_id","held_at");--> statement-breakpoint
CREATE UNIQUE INDEX "practicals_corrects_uq" ON "practicals" USING btree ("corrects_id");--> statement-breakpoint
CREATE UNIQUE INDEX "signoff_entries_item_uq" ON "signoff_entries" USING btree ("signoff_id","item_id");--> statement-breakpoint
CREATE INDEX "signoffs_person_idx" ON "signoffs" USING btree ("person_id","updated_at");--> statement-breakpoint
CREATE INDEX "signoffs_site_idx" ON "signoffs" USING btree ("site_id","status","updated_at");--> statement-breakpoint
CREATE INDEX "signoffs_pending_idx" ON "signoffs" USING btree ("site_id","submitted_at") WHERE "signoffs"."status" = 'submitted';--> statement-breakpoint
CREATE UNIQUE INDEX "signoffs_corrects_uq" ON "signoffs" USING btree ("corrects_id");