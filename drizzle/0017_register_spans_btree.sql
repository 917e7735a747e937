DROP INDEX "authorisation_state_spans_span_idx";--> statement-breakpoint
DROP INDEX "authorisation_state_spans_state_span_idx";--> statement-breakpoint
DROP INDEX "authorisation_state_spans_authorisation_idx";--> statement-breakpoint
DROP INDEX "authorisation_state_spans_holder_idx";--> statement-breakpoint
ALTER TABLE "authorisation_state_spans" ADD COLUMN "from_at" timestamp with time zone GENERATED ALWAYS AS (lower(span)) STORED;--> statement-breakpoint
ALTER TABLE "authorisation_state_spans" ADD COLUMN "to_at" timestamp with time zone GENERATED ALWAYS AS (upper(span)) STORED;--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_moment_idx" ON "authorisation_state_spans" USING btree ("to_at","from_at");--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_state_idx" ON "authorisation_state_spans" USING btree ("state","to_at","from_at");--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_scope_idx" ON "authorisation_state_spans" USING btree ("scope_id","to_at","from_at");--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_authorisation_idx" ON "authorisation_state_spans" USING btree ("authorisation_id","to_at","from_at");--> statement-breakpoint
CREATE INDEX "authorisation_state_spans_holder_idx" ON "authorisation_state_spans" USING btree ("holder_id","to_at","from_at");