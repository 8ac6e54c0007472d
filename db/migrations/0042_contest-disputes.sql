CREATE TABLE "contest_disputes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"round_id" uuid NOT NULL,
	"entry_id" uuid NOT NULL,
	"subject" text NOT NULL,
	"lodged_by" text NOT NULL,
	"lodged_at" timestamp with time zone DEFAULT now() NOT NULL,
	"recorded_by" uuid,
	"status" text DEFAULT 'open' NOT NULL,
	"outcome" text,
	"action" text,
	"resolved_by" uuid,
	"resolved_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "contest_disputes" ADD CONSTRAINT "contest_disputes_round_id_contest_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."contest_rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_disputes" ADD CONSTRAINT "contest_disputes_entry_id_contest_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."contest_entries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_disputes" ADD CONSTRAINT "contest_disputes_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_disputes" ADD CONSTRAINT "contest_disputes_resolved_by_users_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "contest_disputes_round_idx" ON "contest_disputes" USING btree ("round_id","entry_id");