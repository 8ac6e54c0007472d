CREATE TABLE "slot_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"slot_id" uuid NOT NULL,
	"paper_flights" jsonb,
	"run_id" uuid,
	"lane" smallint,
	"recorded_by" uuid,
	"recorded_at" timestamp with time zone,
	"signed_at" timestamp with time zone,
	"signed_from" text,
	"kept_at" timestamp with time zone DEFAULT now() NOT NULL,
	"outcome" text,
	"decided_by" uuid,
	"decided_at" timestamp with time zone
);
--> statement-breakpoint
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
ALTER TABLE "slot_records" ADD CONSTRAINT "slot_records_slot_id_group_slots_id_fk" FOREIGN KEY ("slot_id") REFERENCES "public"."group_slots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "slot_records" ADD CONSTRAINT "slot_records_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "slot_records" ADD CONSTRAINT "slot_records_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_round_id_contest_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."contest_rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_entry_id_contest_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."contest_entries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_granted_by_users_id_fk" FOREIGN KEY ("granted_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "slot_records_slot_idx" ON "slot_records" USING btree ("slot_id");