CREATE TYPE "public"."lane_consent_status" AS ENUM('accepted', 'disputed', 'hidden');--> statement-breakpoint
CREATE TABLE "lane_consents" (
	"run_id" uuid NOT NULL,
	"lane" smallint NOT NULL,
	"pilot_user_id" uuid NOT NULL,
	"status" "lane_consent_status" NOT NULL,
	"reason" text,
	"decided_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lane_consents_run_id_lane_pk" PRIMARY KEY("run_id","lane")
);
--> statement-breakpoint
ALTER TABLE "lane_consents" ADD CONSTRAINT "lane_consents_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lane_consents" ADD CONSTRAINT "lane_consents_pilot_user_id_users_id_fk" FOREIGN KEY ("pilot_user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "lane_consents_pilot_user_id_idx" ON "lane_consents" USING btree ("pilot_user_id");