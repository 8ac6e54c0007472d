CREATE TABLE "season_week_turnarounds" (
	"pilot_user_id" uuid NOT NULL,
	"week" date NOT NULL,
	"turnarounds" integer NOT NULL,
	"median_ms" double precision NOT NULL,
	"p90_ms" double precision NOT NULL,
	CONSTRAINT "season_week_turnarounds_pilot_user_id_week_pk" PRIMARY KEY("pilot_user_id","week")
);
--> statement-breakpoint
ALTER TABLE "season_week_turnarounds" ADD CONSTRAINT "season_week_turnarounds_pilot_user_id_users_id_fk" FOREIGN KEY ("pilot_user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "runs_created_at_idx" ON "runs" USING btree ("created_at");