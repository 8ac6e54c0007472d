CREATE TABLE "club_day_closed_runs" (
	"day_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	CONSTRAINT "club_day_closed_runs_day_id_run_id_pk" PRIMARY KEY("day_id","run_id")
);
--> statement-breakpoint
CREATE TABLE "club_day_decisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"club_id" uuid NOT NULL,
	"day" date NOT NULL,
	"run_id" uuid NOT NULL,
	"lane" integer NOT NULL,
	"device_id" text,
	"note" text DEFAULT '' NOT NULL,
	"decided_by" uuid,
	"decided_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "club_day_decisions_lane_uq" UNIQUE("club_id","day","run_id","lane")
);
--> statement-breakpoint
ALTER TABLE "clubs" ADD COLUMN "time_zone" text DEFAULT 'UTC' NOT NULL;--> statement-breakpoint
ALTER TABLE "club_days" ADD COLUMN "runs_frozen_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "club_day_closed_runs" ADD CONSTRAINT "club_day_closed_runs_day_id_club_days_id_fk" FOREIGN KEY ("day_id") REFERENCES "public"."club_days"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "club_day_closed_runs" ADD CONSTRAINT "club_day_closed_runs_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "club_day_decisions" ADD CONSTRAINT "club_day_decisions_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "club_day_decisions" ADD CONSTRAINT "club_day_decisions_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "club_day_decisions" ADD CONSTRAINT "club_day_decisions_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "club_day_closed_runs_run_id_idx" ON "club_day_closed_runs" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "club_day_decisions_run_id_idx" ON "club_day_decisions" USING btree ("run_id");