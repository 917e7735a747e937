CREATE TABLE "authorisation_state_spans" (
	"period_id" uuid NOT NULL,
	"authorisation_id" uuid NOT NULL,
	"holder_id" uuid NOT NULL,
	"scope_id" uuid NOT NULL,
	"state" text NOT NULL,
	"since" timestamp with time zone NOT NULL,
	"span" "tstzrange" NOT NULL
);
--> statement-breakpoint
ALTER TABLE "authorisation_state_spans" ADD CONSTRAINT "authorisation_state_spans_period_id_authorisation_periods_id_fk" FOREIGN KEY ("period_id") REFERENCES "public"."authorisation_periods"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_span_idx" ON "authorisation_state_spans" USING gist ("span");--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_state_span_idx" ON "authorisation_state_spans" USING gist ("state","span");--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_authorisation_idx" ON "authorisation_state_spans" USING btree ("authorisation_id");--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_holder_idx" ON "authorisation_state_spans" USING btree ("holder_id");