ALTER TABLE "group_slots" ADD COLUMN "timekeeper_user_id" uuid;--> statement-breakpoint
ALTER TABLE "group_slots" ADD COLUMN "timekeeper_assigned_by" uuid;--> statement-breakpoint
ALTER TABLE "group_slots" ADD COLUMN "timekeeper_assigned_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "group_slots" ADD CONSTRAINT "group_slots_timekeeper_user_id_users_id_fk" FOREIGN KEY ("timekeeper_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "group_slots" ADD CONSTRAINT "group_slots_timekeeper_assigned_by_users_id_fk" FOREIGN KEY ("timekeeper_assigned_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "group_slots_timekeeper_idx" ON "group_slots" USING btree ("timekeeper_user_id");