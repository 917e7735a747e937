CREATE TABLE "practical_attempts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"practical_id" uuid NOT NULL,
	"item_id" uuid NOT NULL,
	"seq" integer NOT NULL,
	"value" double precision,
	"did_not_trip" boolean NOT NULL,
	"unit" text NOT NULL,
	"instrument_id" uuid NOT NULL,
	"expected" double precision,
	"tolerance" text,
	"verdict" text,
	"judged_by" text,
	"reason" text,
	"recorded_at" timestamp with time zone NOT NULL,
	"recorded_by" uuid NOT NULL,
	CONSTRAINT "practical_attempts_verdict_ck" CHECK ("practical_attempts"."verdict" is null or "practical_attempts"."verdict" in ('pass', 'fail')),
	CONSTRAINT "practical_attempts_value_ck" CHECK (("practical_attempts"."value" is not null) <> "practical_attempts"."did_not_trip")
);
--> statement-breakpoint
ALTER TABLE "practical_attempts" ADD CONSTRAINT "practical_attempts_practical_id_practicals_id_fk" FOREIGN KEY ("practical_id") REFERENCES "public"."practicals"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_attempts" ADD CONSTRAINT "practical_attempts_item_id_checklist_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."checklist_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_attempts" ADD CONSTRAINT "practical_attempts_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practical_attempts" ADD CONSTRAINT "practical_attempts_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "practical_attempts_seq_uq" ON "practical_attempts" USING btree ("practical_id","seq");--> statement-breakpoint
CREATE INDEX "practical_attempts_item_idx" ON "practical_attempts" USING btree ("practical_id","item_id","seq");--> statement-breakpoint
-- Readings already recorded are their item's first attempt (earlier re-records left only the audit trail).
INSERT INTO practical_attempts (practical_id, item_id, seq, value, did_not_trip, unit, instrument_id, expected, tolerance, verdict, judged_by, reason, recorded_at, recorded_by)
SELECT practical_id, item_id, seq, value, did_not_trip, unit, instrument_id, expected, tolerance, verdict, judged_by, NULL, recorded_at, recorded_by
FROM practical_entries WHERE kind = 'measurement' AND seq IS NOT NULL;--> statement-breakpoint
-- Attempts are only ever added, and only while their practical is being recorded.
CREATE TRIGGER practical_attempts_guard BEFORE INSERT OR UPDATE ON practical_attempts FOR EACH ROW EXECUTE FUNCTION record_entry_guard();--> statement-breakpoint
REVOKE UPDATE, DELETE, TRUNCATE ON practical_attempts FROM breakover_app;
