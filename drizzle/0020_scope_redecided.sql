ALTER TABLE "scopes" ADD COLUMN "redecided_at" timestamp with time zone;--> statement-breakpoint
-- Scopes that exist already were decided for everyone as their evidence came in.
UPDATE "scopes" SET "redecided_at" = "updated_at";
