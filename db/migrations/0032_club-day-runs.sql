CREATE TABLE "club_day_runs" (
	"day_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	"chosen_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "club_day_runs_day_id_run_id_pk" PRIMARY KEY("day_id","run_id")
);
--> statement-breakpoint
ALTER TABLE "club_day_runs" ADD CONSTRAINT "club_day_runs_day_id_club_days_id_fk" FOREIGN KEY ("day_id") REFERENCES "public"."club_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "club_day_runs" ADD CONSTRAINT "club_day_runs_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "club_day_runs" ADD CONSTRAINT "club_day_runs_chosen_by_users_id_fk" FOREIGN KEY ("chosen_by") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "club_day_runs_run_id_idx" ON "club_day_runs" USING btree ("run_id");