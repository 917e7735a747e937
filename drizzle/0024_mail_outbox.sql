-- mail_log becomes the one outbox: rows are written with the change that causes them and delivered later.
ALTER TABLE "mail_log" DROP CONSTRAINT "mail_log_status_ck";--> statement-breakpoint
ALTER TABLE "mail_log" ADD COLUMN "dedupe_key" text;--> statement-breakpoint
ALTER TABLE "mail_log" ADD COLUMN "body" text;--> statement-breakpoint
ALTER TABLE "mail_log" ADD COLUMN "attempts" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "mail_log" ADD COLUMN "next_attempt_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "mail_log" ADD COLUMN "claimed_at" timestamp with time zone;--> statement-breakpoint
-- Messages logged before: each its own key, one attempt. Their senders retried a failure with a new row, so an
-- old failed row is not sent again (it has no text to send).
UPDATE "mail_log" SET "dedupe_key" = 'legacy:' || "id", "attempts" = 1, "next_attempt_at" = "created_at";--> statement-breakpoint
ALTER TABLE "mail_log" ALTER COLUMN "dedupe_key" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "mail_log" ALTER COLUMN "next_attempt_at" SET NOT NULL;--> statement-breakpoint
CREATE UNIQUE INDEX "mail_log_dedupe_uq" ON "mail_log" USING btree ("dedupe_key");--> statement-breakpoint
CREATE INDEX "mail_log_due_idx" ON "mail_log" USING btree ("next_attempt_at") WHERE "mail_log"."status" in ('waiting', 'sending');--> statement-breakpoint
ALTER TABLE "mail_log" ADD CONSTRAINT "mail_log_status_ck" CHECK ("mail_log"."status" in ('waiting', 'sending', 'sent', 'failed', 'cancelled'));--> statement-breakpoint
-- Review reminders claimed by a sender that never finished go to the outbox like every unsent one.
UPDATE "procedure_review_reminders" SET "claimed_at" = NULL WHERE "sent_at" IS NULL;
