CREATE TABLE "signin_rate_limit" (
	"key" text PRIMARY KEY NOT NULL,
	"hits" integer NOT NULL,
	"reset_at" timestamp with time zone NOT NULL,
	CONSTRAINT "signin_rate_limit_hits_ck" CHECK ("signin_rate_limit"."hits" >= 0)
);
--> statement-breakpoint
CREATE INDEX "signin_rate_limit_reset_idx" ON "signin_rate_limit" USING btree ("reset_at");