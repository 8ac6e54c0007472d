CREATE TABLE "coach_invites" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"pilot_id" uuid NOT NULL,
	"email" text,
	"code_hash" text,
	"expires_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"accepted_at" timestamp with time zone,
	"revoked_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "coach_invites" ADD CONSTRAINT "coach_invites_pilot_id_users_id_fk" FOREIGN KEY ("pilot_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "coach_invites_pilot_id_idx" ON "coach_invites" USING btree ("pilot_id");--> statement-breakpoint
CREATE INDEX "coach_invites_email_idx" ON "coach_invites" USING btree ("email");--> statement-breakpoint
CREATE UNIQUE INDEX "coach_invites_code_hash_uq" ON "coach_invites" USING btree ("code_hash");