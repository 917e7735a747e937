CREATE TABLE "bench_type_ac_decisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"bench_id" uuid NOT NULL,
	"decided_by" uuid NOT NULL,
	"decided_at" timestamp with time zone NOT NULL,
	"reason" text NOT NULL,
	CONSTRAINT "bench_type_ac_decisions_reason_ck" CHECK (length("bench_type_ac_decisions"."reason") >= 10)
);
--> statement-breakpoint
ALTER TABLE "practicals" ADD COLUMN "cross_site_reason" text;--> statement-breakpoint
ALTER TABLE "practicals" ADD COLUMN "type_ac_decision_id" uuid;--> statement-breakpoint
ALTER TABLE "bench_type_ac_decisions" ADD CONSTRAINT "bench_type_ac_decisions_bench_id_benches_id_fk" FOREIGN KEY ("bench_id") REFERENCES "public"."benches"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_type_ac_decisions" ADD CONSTRAINT "bench_type_ac_decisions_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bench_type_ac_decisions_bench_idx" ON "bench_type_ac_decisions" USING btree ("bench_id","decided_at" DESC NULLS LAST);--> statement-breakpoint
ALTER TABLE "practicals" ADD CONSTRAINT "practicals_type_ac_decision_id_bench_type_ac_decisions_id_fk" FOREIGN KEY ("type_ac_decision_id") REFERENCES "public"."bench_type_ac_decisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
-- A Type AC decision is kept as recorded: a new decision is a new row.
REVOKE UPDATE, DELETE, TRUNCATE ON bench_type_ac_decisions FROM breakover_app;
