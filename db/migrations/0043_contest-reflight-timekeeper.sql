ALTER TABLE "contest_reflights" ADD COLUMN "timekeeper_user_id" uuid;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD COLUMN "timekeeper_assigned_by" uuid;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD COLUMN "timekeeper_assigned_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_timekeeper_user_id_users_id_fk" FOREIGN KEY ("timekeeper_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_reflights" ADD CONSTRAINT "contest_reflights_timekeeper_assigned_by_users_id_fk" FOREIGN KEY ("timekeeper_assigned_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "contest_reflights_timekeeper_idx" ON "contest_reflights" USING btree ("timekeeper_user_id");