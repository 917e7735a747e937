CREATE TABLE "checklist_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"checklist_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"key" uuid NOT NULL,
	"kind" text NOT NULL,
	"prompt" text NOT NULL,
	"guidance" text,
	"unit" text,
	"rule" jsonb,
	CONSTRAINT "checklist_items_kind_ck" CHECK ("checklist_items"."kind" in ('tick', 'text', 'evidence', 'measurement')),
	CONSTRAINT "checklist_items_measurement_ck" CHECK (("checklist_items"."kind" = 'measurement') = ("checklist_items"."unit" is not null and "checklist_items"."rule" is not null)),
	CONSTRAINT "checklist_items_rule_type_ck" CHECK ("checklist_items"."rule" is null or "checklist_items"."rule"->>'type' in ('range', 'preset', 'earth-continuity', 'computed'))
);
--> statement-breakpoint
CREATE TABLE "procedure_checklists" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"key" uuid NOT NULL,
	"kind" text NOT NULL,
	"title" text NOT NULL,
	CONSTRAINT "procedure_checklists_kind_ck" CHECK ("procedure_checklists"."kind" in ('self-sign-off', 'practical-assessment', 'bench-pre-use'))
);
--> statement-breakpoint
CREATE TABLE "procedure_steps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"key" uuid NOT NULL,
	"text" text NOT NULL,
	"caution" text,
	"hold_point" boolean NOT NULL
);
--> statement-breakpoint
CREATE TABLE "procedure_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"procedure_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"status" text NOT NULL,
	"based_on_id" uuid,
	"title" text NOT NULL,
	"category" text NOT NULL,
	"review_period_months" integer NOT NULL,
	"scope" text NOT NULL,
	"hazards" text[] NOT NULL,
	"ppe" text[] NOT NULL,
	"equipment" text[] NOT NULL,
	"change_class" text,
	"change_summary" text,
	"reread_days" integer NOT NULL,
	"author_id" uuid NOT NULL,
	"editor_ids" uuid[] DEFAULT '{}'::uuid[] NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone NOT NULL,
	"submitted_at" timestamp with time zone,
	"returned_at" timestamp with time zone,
	"returned_by" uuid,
	"return_comment" text,
	"approved_by" uuid,
	"approval_signature_id" uuid,
	"published_at" timestamp with time zone,
	"review_due_on" date,
	"ack_from_number" integer,
	"assess_from_number" integer,
	"superseded_at" timestamp with time zone,
	"withdrawn_at" timestamp with time zone,
	"withdrawn_by" uuid,
	"withdrawn_reason" text,
	CONSTRAINT "procedure_versions_number_ck" CHECK ("procedure_versions"."number" >= 1),
	CONSTRAINT "procedure_versions_status_ck" CHECK ("procedure_versions"."status" in ('draft', 'in_review', 'published', 'superseded', 'withdrawn')),
	CONSTRAINT "procedure_versions_category_ck" CHECK ("procedure_versions"."category" in ('dead-work', 'live-testing', 'live-fault-finding', 'commissioning', 'bench-equipment', 'general')),
	CONSTRAINT "procedure_versions_class_ck" CHECK ("procedure_versions"."change_class" is null or "procedure_versions"."change_class" in ('editorial', 're-read', 're-assess')),
	CONSTRAINT "procedure_versions_period_ck" CHECK ("procedure_versions"."review_period_months" between 1 and 60),
	CONSTRAINT "procedure_versions_reread_ck" CHECK ("procedure_versions"."reread_days" between 1 and 180),
	CONSTRAINT "procedure_versions_later_states_class_ck" CHECK ("procedure_versions"."number" = 1 or "procedure_versions"."status" = 'draft' or ("procedure_versions"."change_class" is not null and length("procedure_versions"."change_summary") > 0)),
	CONSTRAINT "procedure_versions_published_ck" CHECK ("procedure_versions"."status" in ('draft', 'in_review') or ("procedure_versions"."approval_signature_id" is not null and "procedure_versions"."published_at" is not null and "procedure_versions"."review_due_on" is not null and "procedure_versions"."ack_from_number" is not null)),
	CONSTRAINT "procedure_versions_four_eyes_ck" CHECK ("procedure_versions"."approved_by" is null or ("procedure_versions"."approved_by" <> "procedure_versions"."author_id" and not ("procedure_versions"."approved_by" = any("procedure_versions"."editor_ids")))),
	CONSTRAINT "procedure_versions_withdrawn_ck" CHECK ("procedure_versions"."status" <> 'withdrawn' or ("procedure_versions"."withdrawn_at" is not null and length("procedure_versions"."withdrawn_reason") >= 3))
);
--> statement-breakpoint
CREATE TABLE "procedures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"site_id" uuid NOT NULL,
	"owner_id" uuid NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone NOT NULL,
	"updated_by" uuid NOT NULL,
	CONSTRAINT "procedures_code_ck" CHECK ("procedures"."code" ~ '^[A-Z0-9][A-Z0-9-]{2,23}$')
);
--> statement-breakpoint
CREATE TABLE "procedure_acknowledgements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"procedure_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"version_number" integer NOT NULL,
	"user_id" uuid NOT NULL,
	"signature_id" uuid NOT NULL,
	"acknowledged_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "procedure_reread_requests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"procedure_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"change_class" text NOT NULL,
	"due_on" date NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"extended_at" timestamp with time zone,
	"extended_by" uuid,
	"extension_reason" text,
	CONSTRAINT "procedure_reread_class_ck" CHECK ("procedure_reread_requests"."change_class" in ('re-read', 're-assess')),
	CONSTRAINT "procedure_reread_extension_ck" CHECK (("procedure_reread_requests"."extended_at" is null) = ("procedure_reread_requests"."extension_reason" is null))
);
--> statement-breakpoint
CREATE TABLE "procedure_review_reminders" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version_id" uuid NOT NULL,
	"manager_id" uuid NOT NULL,
	"offset_days" integer NOT NULL,
	"review_due_on" date NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"claimed_at" timestamp with time zone,
	"sent_at" timestamp with time zone,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	CONSTRAINT "procedure_review_reminders_offset_ck" CHECK ("procedure_review_reminders"."offset_days" between 0 and 365)
);
--> statement-breakpoint
ALTER TABLE "checklist_items" ADD CONSTRAINT "checklist_items_checklist_id_procedure_checklists_id_fk" FOREIGN KEY ("checklist_id") REFERENCES "public"."procedure_checklists"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_checklists" ADD CONSTRAINT "procedure_checklists_version_id_procedure_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_steps" ADD CONSTRAINT "procedure_steps_version_id_procedure_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_versions" ADD CONSTRAINT "procedure_versions_procedure_id_procedures_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_versions" ADD CONSTRAINT "procedure_versions_based_on_id_procedure_versions_id_fk" FOREIGN KEY ("based_on_id") REFERENCES "public"."procedure_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_versions" ADD CONSTRAINT "procedure_versions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_versions" ADD CONSTRAINT "procedure_versions_returned_by_users_id_fk" FOREIGN KEY ("returned_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_versions" ADD CONSTRAINT "procedure_versions_approved_by_users_id_fk" FOREIGN KEY ("approved_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_versions" ADD CONSTRAINT "procedure_versions_approval_signature_id_signatures_id_fk" FOREIGN KEY ("approval_signature_id") REFERENCES "public"."signatures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_versions" ADD CONSTRAINT "procedure_versions_withdrawn_by_users_id_fk" FOREIGN KEY ("withdrawn_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedures" ADD CONSTRAINT "procedures_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedures" ADD CONSTRAINT "procedures_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedures" ADD CONSTRAINT "procedures_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_acknowledgements" ADD CONSTRAINT "procedure_acknowledgements_procedure_id_procedures_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_acknowledgements" ADD CONSTRAINT "procedure_acknowledgements_version_id_procedure_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_acknowledgements" ADD CONSTRAINT "procedure_acknowledgements_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_acknowledgements" ADD CONSTRAINT "procedure_acknowledgements_signature_id_signatures_id_fk" FOREIGN KEY ("signature_id") REFERENCES "public"."signatures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_reread_requests" ADD CONSTRAINT "procedure_reread_requests_procedure_id_procedures_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedures"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_reread_requests" ADD CONSTRAINT "procedure_reread_requests_version_id_procedure_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_reread_requests" ADD CONSTRAINT "procedure_reread_requests_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_reread_requests" ADD CONSTRAINT "procedure_reread_requests_extended_by_users_id_fk" FOREIGN KEY ("extended_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_review_reminders" ADD CONSTRAINT "procedure_review_reminders_version_id_procedure_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_review_reminders" ADD CONSTRAINT "procedure_review_reminders_manager_id_users_id_fk" FOREIGN KEY ("manager_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "checklist_items_position_uq" ON "checklist_items" USING btree ("checklist_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "checklist_items_key_uq" ON "checklist_items" USING btree ("checklist_id","key");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_checklists_position_uq" ON "procedure_checklists" USING btree ("version_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_checklists_key_uq" ON "procedure_checklists" USING btree ("version_id","key");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_steps_position_uq" ON "procedure_steps" USING btree ("version_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_steps_key_uq" ON "procedure_steps" USING btree ("version_id","key");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_versions_number_uq" ON "procedure_versions" USING btree ("procedure_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_versions_one_published_uq" ON "procedure_versions" USING btree ("procedure_id") WHERE "procedure_versions"."status" = 'published';--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_versions_one_open_uq" ON "procedure_versions" USING btree ("procedure_id") WHERE "procedure_versions"."status" in ('draft', 'in_review');--> statement-breakpoint
CREATE INDEX "procedure_versions_review_due_idx" ON "procedure_versions" USING btree ("review_due_on") WHERE "procedure_versions"."status" = 'published';--> statement-breakpoint
CREATE UNIQUE INDEX "procedures_code_uq" ON "procedures" USING btree ("code");--> statement-breakpoint
CREATE INDEX "procedures_updated_idx" ON "procedures" USING btree ("updated_at");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_acks_version_user_uq" ON "procedure_acknowledgements" USING btree ("version_id","user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_acks_signature_uq" ON "procedure_acknowledgements" USING btree ("signature_id");--> statement-breakpoint
CREATE INDEX "procedure_acks_procedure_user_idx" ON "procedure_acknowledgements" USING btree ("procedure_id","user_id","version_number");--> statement-breakpoint
CREATE INDEX "procedure_acks_user_idx" ON "procedure_acknowledgements" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_reread_version_user_uq" ON "procedure_reread_requests" USING btree ("version_id","user_id");--> statement-breakpoint
CREATE INDEX "procedure_reread_user_idx" ON "procedure_reread_requests" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_review_reminders_uq" ON "procedure_review_reminders" USING btree ("version_id","manager_id","offset_days");--> statement-breakpoint
CREATE INDEX "procedure_review_reminders_unsent_idx" ON "procedure_review_reminders" USING btree ("created_at") WHERE "procedure_review_reminders"."sent_at" is null;