CREATE TABLE "signatures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"signer_id" uuid NOT NULL,
	"printed_name" text NOT NULL,
	"meaning" text NOT NULL,
	"entity" text NOT NULL,
	"entity_id" text NOT NULL,
	"signed_at" timestamp with time zone NOT NULL,
	CONSTRAINT "signatures_meaning_ck" CHECK (length("signatures"."meaning") between 3 and 200)
);
--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_signer_id_users_id_fk" FOREIGN KEY ("signer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "signatures_entity_idx" ON "signatures" USING btree ("entity","entity_id");--> statement-breakpoint
CREATE INDEX "signatures_signer_idx" ON "signatures" USING btree ("signer_id","signed_at");