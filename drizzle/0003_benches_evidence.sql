CREATE TABLE "bench_checks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"seq" bigint GENERATED ALWAYS AS IDENTITY (sequence name "bench_checks_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"bench_id" uuid NOT NULL,
	"person_id" uuid NOT NULL,
	"at" timestamp with time zone NOT NULL,
	"passed" boolean NOT NULL,
	"notes" text,
	"checklist_response_id" uuid,
	CONSTRAINT "bench_checks_failed_notes_ck" CHECK ("bench_checks"."passed" or "bench_checks"."notes" is not null)
);
--> statement-breakpoint
CREATE TABLE "benches" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"site_id" uuid NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"supply_voltage" integer NOT NULL,
	"supply_frequency" integer NOT NULL,
	"isolating_transformer" boolean NOT NULL,
	"isolating_transformer_va" integer,
	"rcd_type" text,
	"rcd_rated_residual_ma" integer,
	"emergency_stop" boolean NOT NULL,
	"next_inspection_on" date NOT NULL,
	"notes" text,
	"active" boolean NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone NOT NULL,
	CONSTRAINT "benches_supply_voltage_ck" CHECK ("benches"."supply_voltage" between 1 and 1000),
	CONSTRAINT "benches_supply_frequency_ck" CHECK ("benches"."supply_frequency" in (50, 60)),
	CONSTRAINT "benches_transformer_ck" CHECK (("benches"."isolating_transformer" and "benches"."isolating_transformer_va" > 0) or (not "benches"."isolating_transformer" and "benches"."isolating_transformer_va" is null)),
	CONSTRAINT "benches_rcd_ck" CHECK (("benches"."rcd_type" is null and "benches"."rcd_rated_residual_ma" is null) or ("benches"."rcd_type" in ('AC', 'A', 'F', 'B') and "benches"."rcd_rated_residual_ma" > 0))
);
--> statement-breakpoint
CREATE TABLE "instruments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"site_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"make" text NOT NULL,
	"model" text NOT NULL,
	"serial" text NOT NULL,
	"measurement_category" text,
	"voltage_rating" integer,
	"true_rms" boolean NOT NULL,
	"calibration_due_on" date NOT NULL,
	"notes" text,
	"active" boolean NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone NOT NULL,
	CONSTRAINT "instruments_category_ck" CHECK (("instruments"."measurement_category" is null and "instruments"."voltage_rating" is null) or ("instruments"."measurement_category" in ('CAT II', 'CAT III', 'CAT IV') and "instruments"."voltage_rating" > 0)),
	CONSTRAINT "instruments_kind_ck" CHECK ("instruments"."kind" in ('multimeter', 'clamp_meter', 'insulation_tester', 'rcd_tester', 'multifunction_tester', 'earth_continuity_tester', 'oscilloscope', 'differential_probe', 'current_probe', 'voltage_detector', 'proving_unit', 'other'))
);
--> statement-breakpoint
CREATE TABLE "evidence" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"uploader_id" uuid NOT NULL,
	"entity" text NOT NULL,
	"entity_id" text NOT NULL,
	"file_name" text NOT NULL,
	"media_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"caption" text,
	"content" "bytea" NOT NULL,
	"uploaded_at" timestamp with time zone NOT NULL,
	CONSTRAINT "evidence_media_type_ck" CHECK ("evidence"."media_type" in ('image/jpeg', 'image/png', 'application/pdf', 'text/csv')),
	CONSTRAINT "evidence_sha256_ck" CHECK ("evidence"."sha256" ~ '^[0-9a-f]{64}$'),
	CONSTRAINT "evidence_size_ck" CHECK ("evidence"."size_bytes" > 0 and "evidence"."size_bytes" = octet_length("evidence"."content"))
);
--> statement-breakpoint
ALTER TABLE "bench_checks" ADD CONSTRAINT "bench_checks_bench_id_benches_id_fk" FOREIGN KEY ("bench_id") REFERENCES "public"."benches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_checks" ADD CONSTRAINT "bench_checks_person_id_users_id_fk" FOREIGN KEY ("person_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "benches" ADD CONSTRAINT "benches_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "instruments" ADD CONSTRAINT "instruments_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence" ADD CONSTRAINT "evidence_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence" ADD CONSTRAINT "evidence_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence" ADD CONSTRAINT "evidence_uploader_id_users_id_fk" FOREIGN KEY ("uploader_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bench_checks_bench_latest_idx" ON "bench_checks" USING btree ("bench_id","at" DESC NULLS LAST,"seq" DESC NULLS LAST);--> statement-breakpoint
CREATE UNIQUE INDEX "benches_site_code_uq" ON "benches" USING btree ("site_id","code");--> statement-breakpoint
CREATE INDEX "benches_site_inspection_idx" ON "benches" USING btree ("site_id","next_inspection_on");--> statement-breakpoint
CREATE UNIQUE INDEX "instruments_identity_uq" ON "instruments" USING btree ("make","model","serial");--> statement-breakpoint
CREATE INDEX "instruments_site_calibration_idx" ON "instruments" USING btree ("site_id","calibration_due_on");--> statement-breakpoint
CREATE INDEX "instruments_serial_idx" ON "instruments" USING btree ("serial");--> statement-breakpoint
CREATE INDEX "evidence_owner_idx" ON "evidence" USING btree ("owner_id","uploaded_at");--> statement-breakpoint
CREATE INDEX "evidence_entity_idx" ON "evidence" USING btree ("entity","entity_id");--> statement-breakpoint
CREATE INDEX "evidence_site_idx" ON "evidence" USING btree ("site_id","uploaded_at");