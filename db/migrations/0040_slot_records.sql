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
ALTER TABLE "slot_records" ADD CONSTRAINT "slot_records_slot_id_group_slots_id_fk" FOREIGN KEY ("slot_id") REFERENCES "public"."group_slots"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "slot_records" ADD CONSTRAINT "slot_records_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "slot_records" ADD CONSTRAINT "slot_records_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "slot_records_slot_idx" ON "slot_records" USING btree ("slot_id");