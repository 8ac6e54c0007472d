CREATE TABLE "contest_draw_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"contest_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"round_number" smallint NOT NULL,
	"summary" text NOT NULL,
	"seed" integer,
	"by_user_id" uuid,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "contest_draw_changes" ADD CONSTRAINT "contest_draw_changes_contest_id_contests_id_fk" FOREIGN KEY ("contest_id") REFERENCES "public"."contests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_draw_changes" ADD CONSTRAINT "contest_draw_changes_by_user_id_users_id_fk" FOREIGN KEY ("by_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "contest_draw_changes_contest_idx" ON "contest_draw_changes" USING btree ("contest_id","at");