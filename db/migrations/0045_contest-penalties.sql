CREATE TABLE "contest_penalties" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"round_id" uuid NOT NULL,
	"entry_id" uuid NOT NULL,
	"cause" text NOT NULL,
	"points" smallint NOT NULL,
	"note" text,
	"given_by" uuid,
	"given_at" timestamp with time zone DEFAULT now() NOT NULL,
	"removed_by" uuid,
	"removed_at" timestamp with time zone,
	"removed_reason" text
);
--> statement-breakpoint
ALTER TABLE "contest_disputes" ADD COLUMN "recorded_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
-- hand-written: disputes recorded before this were lodged when recorded
UPDATE "contest_disputes" SET "recorded_at" = "lodged_at";--> statement-breakpoint
ALTER TABLE "contest_penalties" ADD CONSTRAINT "contest_penalties_round_id_contest_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."contest_rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_penalties" ADD CONSTRAINT "contest_penalties_entry_id_contest_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."contest_entries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_penalties" ADD CONSTRAINT "contest_penalties_given_by_users_id_fk" FOREIGN KEY ("given_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_penalties" ADD CONSTRAINT "contest_penalties_removed_by_users_id_fk" FOREIGN KEY ("removed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "contest_penalties_round_idx" ON "contest_penalties" USING btree ("round_id","entry_id");