CREATE TABLE "contest_reflights" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"round_id" uuid NOT NULL,
	"entry_id" uuid NOT NULL,
	"cause" text NOT NULL,
	"placement" text NOT NULL,
	"entitled" boolean DEFAULT true NOT NULL,
	"group_number" smallint NOT NULL,
	"reason" text,
	"granted_by" uuid,
	"granted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"paper_flights" jsonb,
	"run_id" uuid,
	"lane" smallint,
	"recorded_by" uuid,
	"recorded_at" timestamp with time zone,
	"signed_at" timestamp with time zone,
	"signed_from" text,
	CONSTRAINT "contest_reflights_round_entry_uq" UNIQUE("round_id","entry_id")
);
--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_round_id_contest_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."contest_rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_entry_id_contest_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."contest_entries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_granted_by_users_id_fk" FOREIGN KEY ("granted_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;