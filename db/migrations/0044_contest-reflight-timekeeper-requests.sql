CREATE TABLE "contest_reflight_requests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"round_id" uuid NOT NULL,
	"entry_id" uuid NOT NULL,
	"event_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	"lane" smallint NOT NULL,
	"cause" text NOT NULL,
	"placement" text NOT NULL,
	"reason" text,
	"asked_by" uuid,
	"asked_at" timestamp with time zone NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"decided_by" uuid,
	"decided_at" timestamp with time zone,
	"reflight_id" uuid
);
--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD COLUMN "timekeeper_user_id" uuid;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD COLUMN "timekeeper_assigned_by" uuid;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD COLUMN "timekeeper_assigned_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "contest_reflight_requests" ADD CONSTRAINT "contest_reflight_requests_round_id_contest_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."contest_rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflight_requests" ADD CONSTRAINT "contest_reflight_requests_entry_id_contest_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."contest_entries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflight_requests" ADD CONSTRAINT "contest_reflight_requests_asked_by_users_id_fk" FOREIGN KEY ("asked_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflight_requests" ADD CONSTRAINT "contest_reflight_requests_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflight_requests" ADD CONSTRAINT "contest_reflight_requests_reflight_id_contest_reflights_id_fk" FOREIGN KEY ("reflight_id") REFERENCES "public"."contest_reflights"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "contest_reflight_requests_event_uq" ON "contest_reflight_requests" USING btree ("event_id");--> statement-breakpoint
CREATE INDEX "contest_reflight_requests_round_idx" ON "contest_reflight_requests" USING btree ("round_id","status");--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_timekeeper_user_id_users_id_fk" FOREIGN KEY ("timekeeper_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_timekeeper_assigned_by_users_id_fk" FOREIGN KEY ("timekeeper_assigned_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "contest_reflights_timekeeper_idx" ON "contest_reflights" USING btree ("timekeeper_user_id");