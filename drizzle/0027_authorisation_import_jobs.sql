CREATE TABLE "authorisation_import_jobs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"actor_id" uuid NOT NULL,
	"printed_name" text NOT NULL,
	"csv" text NOT NULL,
	"status" text NOT NULL,
	"total" integer NOT NULL,
	"done" integer DEFAULT 0 NOT NULL,
	"written" jsonb,
	"error" text,
	"created_at" timestamp with time zone NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	CONSTRAINT "authorisation_import_jobs_status_ck" CHECK ("authorisation_import_jobs"."status" in ('queued', 'running', 'done', 'failed'))
);
--> statement-breakpoint
ALTER TABLE "authorisation_import_jobs" ADD CONSTRAINT "authorisation_import_jobs_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "authorisation_import_jobs_actor_idx" ON "authorisation_import_jobs" USING btree ("actor_id","created_at");