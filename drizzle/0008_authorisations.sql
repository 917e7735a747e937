CREATE TABLE "authorisation_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"period_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"effective_at" timestamp with time zone NOT NULL,
	"recorded_at" timestamp with time zone NOT NULL,
	"actor_id" uuid,
	"reason" text,
	"cause" text,
	"signature_id" uuid,
	"details" jsonb,
	CONSTRAINT "authorisation_events_kind_ck" CHECK ("authorisation_events"."kind" in ('issued', 'renewed', 'suspended', 'reinstated', 'revoked', 'lapsed', 'renewal_submitted', 'restored', 'ended')),
	CONSTRAINT "authorisation_events_cause_ck" CHECK (("authorisation_events"."kind" in ('suspended', 'reinstated', 'renewal_submitted', 'restored')) = ("authorisation_events"."cause" is not null)),
	CONSTRAINT "authorisation_events_reason_ck" CHECK ("authorisation_events"."kind" not in ('suspended', 'reinstated', 'revoked', 'lapsed', 'ended') or length("authorisation_events"."reason") >= 3),
	CONSTRAINT "authorisation_events_signed_ck" CHECK (not ("authorisation_events"."kind" = 'revoked' or "authorisation_events"."cause" = 'manual') or ("authorisation_events"."actor_id" is not null and "authorisation_events"."signature_id" is not null))
);
--> statement-breakpoint
CREATE TABLE "authorisation_periods" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"authorisation_id" uuid NOT NULL,
	"holder_id" uuid NOT NULL,
	"scope_id" uuid NOT NULL,
	"starts_at" timestamp with time zone NOT NULL,
	"ends_at" timestamp with time zone NOT NULL,
	"validity_ends_at" timestamp with time zone NOT NULL,
	"during" "tstzrange" GENERATED ALWAYS AS (tstzrange("starts_at", "ends_at", '[)')) STORED NOT NULL,
	"origin" text NOT NULL,
	"previous_period_id" uuid,
	"verification_code" text NOT NULL,
	"evidence_snapshot" jsonb NOT NULL,
	"issued_by" uuid,
	"attested_by" text,
	"prior_evidence_id" uuid,
	"prior_note" text,
	"recorded_at" timestamp with time zone NOT NULL,
	CONSTRAINT "authorisation_periods_order_ck" CHECK ("authorisation_periods"."ends_at" >= "authorisation_periods"."starts_at" and "authorisation_periods"."validity_ends_at" > "authorisation_periods"."starts_at" and "authorisation_periods"."ends_at" <= "authorisation_periods"."validity_ends_at"),
	CONSTRAINT "authorisation_periods_origin_ck" CHECK ("authorisation_periods"."origin" in ('issued', 'renewed', 'prior', 'imported')),
	CONSTRAINT "authorisation_periods_code_ck" CHECK ("authorisation_periods"."verification_code" ~ '^[A-Z2-7]{32}$'),
	CONSTRAINT "authorisation_periods_prior_ck" CHECK (("authorisation_periods"."origin" in ('prior', 'imported')) = ("authorisation_periods"."attested_by" is not null)),
	CONSTRAINT "authorisation_periods_renewed_ck" CHECK (("authorisation_periods"."origin" = 'renewed') = ("authorisation_periods"."previous_period_id" is not null))
);
--> statement-breakpoint
CREATE TABLE "authorisations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"holder_id" uuid NOT NULL,
	"scope_id" uuid NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	CONSTRAINT "authorisations_id_holder_scope_uq" UNIQUE("id","holder_id","scope_id")
);
--> statement-breakpoint
CREATE TABLE "external_certificates" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"holder_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"issuer" text NOT NULL,
	"reference" text NOT NULL,
	"issued_on" date NOT NULL,
	"expires_on" date NOT NULL,
	"valid_until" timestamp with time zone NOT NULL,
	"evidence_id" uuid,
	"status" text NOT NULL,
	"submitted_by" uuid NOT NULL,
	"submitted_at" timestamp with time zone NOT NULL,
	"reviewed_by" uuid,
	"reviewed_at" timestamp with time zone,
	"signature_id" uuid,
	"rejection_reason" text,
	CONSTRAINT "external_certificates_kind_ck" CHECK ("external_certificates"."kind" in ('first_aid_cpr', 'first_aid', 'cpr_aed', 'release_from_live_parts', 'electrical_qualification')),
	CONSTRAINT "external_certificates_status_ck" CHECK ("external_certificates"."status" in ('submitted', 'verified', 'rejected')),
	CONSTRAINT "external_certificates_dates_ck" CHECK ("external_certificates"."expires_on" > "external_certificates"."issued_on"),
	CONSTRAINT "external_certificates_verified_ck" CHECK ("external_certificates"."status" <> 'verified' or ("external_certificates"."reviewed_by" is not null and "external_certificates"."signature_id" is not null and "external_certificates"."reviewed_by" <> "external_certificates"."holder_id")),
	CONSTRAINT "external_certificates_rejected_ck" CHECK ("external_certificates"."status" <> 'rejected' or ("external_certificates"."reviewed_by" is not null and length("external_certificates"."rejection_reason") >= 3))
);
--> statement-breakpoint
CREATE TABLE "reminder_sends" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"period_id" uuid,
	"certificate_id" uuid,
	"offset_days" integer NOT NULL,
	"recipient_id" uuid NOT NULL,
	"recipient_role" text NOT NULL,
	"due_at" timestamp with time zone NOT NULL,
	"status" text NOT NULL,
	"attempts" integer NOT NULL,
	"next_attempt_at" timestamp with time zone NOT NULL,
	"last_error" text,
	"sent_at" timestamp with time zone,
	"mail_id" uuid,
	"created_at" timestamp with time zone NOT NULL,
	CONSTRAINT "reminder_sends_subject_ck" CHECK (num_nonnulls("reminder_sends"."period_id", "reminder_sends"."certificate_id") = 1),
	CONSTRAINT "reminder_sends_status_ck" CHECK ("reminder_sends"."status" in ('pending', 'sent', 'cancelled')),
	CONSTRAINT "reminder_sends_role_ck" CHECK ("reminder_sends"."recipient_role" in ('holder', 'manager')),
	CONSTRAINT "reminder_sends_offset_ck" CHECK ("reminder_sends"."offset_days" between 0 and 365),
	CONSTRAINT "reminder_sends_sent_ck" CHECK (("reminder_sends"."status" = 'sent') = ("reminder_sends"."sent_at" is not null))
);
--> statement-breakpoint
CREATE TABLE "scope_requirements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"scope_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"kind" text NOT NULL,
	"procedure_id" uuid,
	"prerequisite_scope_id" uuid,
	"certificate_kind" text,
	"practicals_count" integer,
	"practicals_window_months" integer,
	CONSTRAINT "scope_requirements_kind_ck" CHECK ("scope_requirements"."kind" in ('procedure_ack', 'checklist_signoff', 'practicals', 'prerequisite', 'certificate')),
	CONSTRAINT "scope_requirements_params_ck" CHECK (case "scope_requirements"."kind"
    when 'procedure_ack' then "scope_requirements"."procedure_id" is not null
    when 'checklist_signoff' then "scope_requirements"."procedure_id" is not null
    when 'practicals' then "scope_requirements"."procedure_id" is not null and "scope_requirements"."practicals_count" >= 1 and "scope_requirements"."practicals_window_months" >= 1
    when 'prerequisite' then "scope_requirements"."prerequisite_scope_id" is not null and "scope_requirements"."prerequisite_scope_id" <> "scope_requirements"."scope_id"
    when 'certificate' then "scope_requirements"."certificate_kind" is not null end)
);
--> statement-breakpoint
CREATE TABLE "scopes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"title" text NOT NULL,
	"description" text NOT NULL,
	"max_voltage_v" integer NOT NULL,
	"max_current_a" double precision NOT NULL,
	"allows_live_work" boolean NOT NULL,
	"validity_months" integer NOT NULL,
	"reminder_offsets_days" integer[] NOT NULL,
	"certificate_grace_days" integer NOT NULL,
	"active" boolean NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone NOT NULL,
	CONSTRAINT "scopes_code_ck" CHECK ("scopes"."code" ~ '^[A-Z0-9][A-Z0-9-]{1,23}$'),
	CONSTRAINT "scopes_limits_ck" CHECK ("scopes"."max_voltage_v" between 1 and 1000 and "scopes"."max_current_a" > 0 and "scopes"."max_current_a" <= 100),
	CONSTRAINT "scopes_validity_ck" CHECK ("scopes"."validity_months" between 1 and 60),
	CONSTRAINT "scopes_grace_ck" CHECK ("scopes"."certificate_grace_days" between 0 and 90),
	CONSTRAINT "scopes_offsets_ck" CHECK (cardinality("scopes"."reminder_offsets_days") <= 6 and 1 <= all("scopes"."reminder_offsets_days") and 365 >= all("scopes"."reminder_offsets_days"))
);
--> statement-breakpoint
ALTER TABLE "authorisation_events" ADD CONSTRAINT "authorisation_events_period_id_authorisation_periods_id_fk" FOREIGN KEY ("period_id") REFERENCES "public"."authorisation_periods"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorisation_events" ADD CONSTRAINT "authorisation_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorisation_events" ADD CONSTRAINT "authorisation_events_signature_id_signatures_id_fk" FOREIGN KEY ("signature_id") REFERENCES "public"."signatures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorisation_periods" ADD CONSTRAINT "authorisation_periods_previous_period_id_authorisation_periods_id_fk" FOREIGN KEY ("previous_period_id") REFERENCES "public"."authorisation_periods"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorisation_periods" ADD CONSTRAINT "authorisation_periods_issued_by_users_id_fk" FOREIGN KEY ("issued_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorisation_periods" ADD CONSTRAINT "authorisation_periods_prior_evidence_id_evidence_id_fk" FOREIGN KEY ("prior_evidence_id") REFERENCES "public"."evidence"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorisation_periods" ADD CONSTRAINT "authorisation_periods_authorisation_fk" FOREIGN KEY ("authorisation_id","holder_id","scope_id") REFERENCES "public"."authorisations"("id","holder_id","scope_id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorisations" ADD CONSTRAINT "authorisations_holder_id_users_id_fk" FOREIGN KEY ("holder_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorisations" ADD CONSTRAINT "authorisations_scope_id_scopes_id_fk" FOREIGN KEY ("scope_id") REFERENCES "public"."scopes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "external_certificates" ADD CONSTRAINT "external_certificates_holder_id_users_id_fk" FOREIGN KEY ("holder_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "external_certificates" ADD CONSTRAINT "external_certificates_evidence_id_evidence_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "external_certificates" ADD CONSTRAINT "external_certificates_submitted_by_users_id_fk" FOREIGN KEY ("submitted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "external_certificates" ADD CONSTRAINT "external_certificates_reviewed_by_users_id_fk" FOREIGN KEY ("reviewed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "external_certificates" ADD CONSTRAINT "external_certificates_signature_id_signatures_id_fk" FOREIGN KEY ("signature_id") REFERENCES "public"."signatures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminder_sends" ADD CONSTRAINT "reminder_sends_period_id_authorisation_periods_id_fk" FOREIGN KEY ("period_id") REFERENCES "public"."authorisation_periods"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminder_sends" ADD CONSTRAINT "reminder_sends_certificate_id_external_certificates_id_fk" FOREIGN KEY ("certificate_id") REFERENCES "public"."external_certificates"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminder_sends" ADD CONSTRAINT "reminder_sends_recipient_id_users_id_fk" FOREIGN KEY ("recipient_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scope_requirements" ADD CONSTRAINT "scope_requirements_scope_id_scopes_id_fk" FOREIGN KEY ("scope_id") REFERENCES "public"."scopes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scope_requirements" ADD CONSTRAINT "scope_requirements_procedure_id_procedures_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scope_requirements" ADD CONSTRAINT "scope_requirements_prerequisite_scope_id_scopes_id_fk" FOREIGN KEY ("prerequisite_scope_id") REFERENCES "public"."scopes"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scopes" ADD CONSTRAINT "scopes_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "authorisation_events_period_idx" ON "authorisation_events" USING btree ("period_id","effective_at");--> statement-breakpoint
CREATE INDEX "authorisation_events_kind_idx" ON "authorisation_events" USING btree ("kind","effective_at");--> statement-breakpoint
CREATE UNIQUE INDEX "authorisation_periods_code_uq" ON "authorisation_periods" USING btree ("verification_code");--> statement-breakpoint
CREATE INDEX "authorisation_periods_latest_idx" ON "authorisation_periods" USING btree ("authorisation_id","starts_at");--> statement-breakpoint
CREATE INDEX "authorisation_periods_holder_idx" ON "authorisation_periods" USING btree ("holder_id","scope_id","starts_at");--> statement-breakpoint
CREATE INDEX "authorisation_periods_ends_idx" ON "authorisation_periods" USING btree ("ends_at");--> statement-breakpoint
CREATE UNIQUE INDEX "authorisations_holder_scope_uq" ON "authorisations" USING btree ("holder_id","scope_id");--> statement-breakpoint
CREATE INDEX "authorisations_scope_idx" ON "authorisations" USING btree ("scope_id");--> statement-breakpoint
CREATE INDEX "external_certificates_holder_idx" ON "external_certificates" USING btree ("holder_id","kind","valid_until");--> statement-breakpoint
CREATE INDEX "external_certificates_valid_until_idx" ON "external_certificates" USING btree ("valid_until") WHERE "external_certificates"."status" = 'verified';--> statement-breakpoint
CREATE INDEX "external_certificates_submitted_idx" ON "external_certificates" USING btree ("submitted_at") WHERE "external_certificates"."status" = 'submitted';--> statement-breakpoint
CREATE UNIQUE INDEX "reminder_sends_once_uq" ON "reminder_sends" USING btree (coalesce("period_id", "certificate_id"),"offset_days","recipient_id");--> statement-breakpoint
CREATE INDEX "reminder_sends_pending_idx" ON "reminder_sends" USING btree ("next_attempt_at") WHERE "reminder_sends"."status" = 'pending';--> statement-breakpoint
CREATE INDEX "reminder_sends_recipient_idx" ON "reminder_sends" USING btree ("recipient_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "scope_requirements_position_uq" ON "scope_requirements" USING btree ("scope_id","position");--> statement-breakpoint
CREATE INDEX "scope_requirements_prerequisite_idx" ON "scope_requirements" USING btree ("prerequisite_scope_id");--> statement-breakpoint
CREATE INDEX "scope_requirements_procedure_idx" ON "scope_requirements" USING btree ("procedure_id");--> statement-breakpoint
CREATE UNIQUE INDEX "scopes_code_uq" ON "scopes" USING btree ("code");