CREATE TABLE "lane_flights" (
	"run_id" uuid NOT NULL,
	"lane" smallint NOT NULL,
	"position" integer NOT NULL,
	"flight_index" integer NOT NULL,
	"launch_ms" double precision,
	"land_ms" double precision,
	"status" text,
	"time_tenths" integer,
	"credited_tenths" integer,
	"target_sec" integer,
	"ground_ms" double precision,
	CONSTRAINT "lane_flights_run_id_lane_position_pk" PRIMARY KEY("run_id","lane","position")
);
--> statement-breakpoint
ALTER TABLE "lane_flights" ADD CONSTRAINT "lane_flights_run_id_lane_run_lanes_run_id_lane_fk" FOREIGN KEY ("run_id","lane") REFERENCES "public"."run_lanes"("run_id","lane") ON DELETE cascade ON UPDATE no action;