ALTER TABLE "contests" ADD COLUMN "public_token" text;--> statement-breakpoint
ALTER TABLE "group_slots" ADD COLUMN "paper_flights" jsonb;--> statement-breakpoint
ALTER TABLE "group_slots" ADD COLUMN "recorded_by" uuid;--> statement-breakpoint
ALTER TABLE "group_slots" ADD COLUMN "recorded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "group_slots" ADD COLUMN "signed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "group_slots" ADD COLUMN "signed_from" text;--> statement-breakpoint
ALTER TABLE "group_slots" ADD CONSTRAINT "group_slots_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contests" ADD CONSTRAINT "contests_public_token_unique" UNIQUE("public_token");