ALTER TABLE "runs" ADD COLUMN "plan_id" uuid;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "plan_item" smallint;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD COLUMN "run_id" uuid;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD COLUMN "pilot_id" uuid NOT NULL;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD COLUMN "author_id" uuid NOT NULL;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD COLUMN "reply_to" uuid;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD CONSTRAINT "coach_notes_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD CONSTRAINT "coach_notes_pilot_id_users_id_fk" FOREIGN KEY ("pilot_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD CONSTRAINT "coach_notes_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD CONSTRAINT "coach_notes_reply_to_coach_notes_id_fk" FOREIGN KEY ("reply_to") REFERENCES "public"."coach_notes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "runs_plan_id_idx" ON "runs" USING btree ("plan_id");--> statement-breakpoint
CREATE INDEX "coach_notes_pilot_id_idx" ON "coach_notes" USING btree ("pilot_id");--> statement-breakpoint
CREATE INDEX "coach_notes_coach_id_idx" ON "coach_notes" USING btree ("coach_id");--> statement-breakpoint
CREATE INDEX "coach_notes_reply_to_idx" ON "coach_notes" USING btree ("reply_to");