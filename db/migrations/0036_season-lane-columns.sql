-- The numbers the Season reads per lane, kept by PostgreSQL from run_lanes.derived (generated, stored):
-- one ALTER so the table is rewritten once.
ALTER TABLE "run_lanes"
  ADD COLUMN "season_max_tenths" integer GENERATED ALWAYS AS ((derived #>> '{breakdown,maxTenths}')::int) STORED,
  ADD COLUMN "season_lost_tenths" integer GENERATED ALWAYS AS ((derived #>> '{breakdown,lostTenths}')::int) STORED,
  ADD COLUMN "season_penalty_points" integer GENERATED ALWAYS AS (coalesce((derived #>> '{breakdown,penaltyPoints}')::int, 0)) STORED,
  ADD COLUMN "season_lost_ground_time" integer GENERATED ALWAYS AS (coalesce((derived #>> '{breakdown,parts,groundTime}')::int, 0)) STORED,
  ADD COLUMN "season_lost_over_cap" integer GENERATED ALWAYS AS (coalesce((derived #>> '{breakdown,parts,overCap}')::int, 0)) STORED,
  ADD COLUMN "season_lost_short_of_target" integer GENERATED ALWAYS AS (coalesce((derived #>> '{breakdown,parts,shortOfTarget}')::int, 0)) STORED,
  ADD COLUMN "season_lost_invalid" integer GENERATED ALWAYS AS (coalesce((derived #>> '{breakdown,parts,invalid}')::int, 0)) STORED,
  ADD COLUMN "season_lost_not_counted" integer GENERATED ALWAYS AS (coalesce((derived #>> '{breakdown,parts,notCounted}')::int, 0)) STORED,
  ADD COLUMN "season_lost_round_zero" integer GENERATED ALWAYS AS (coalesce((derived #>> '{breakdown,parts,roundZero}')::int, 0)) STORED,
  ADD COLUMN "season_flight_count" integer GENERATED ALWAYS AS (coalesce(jsonb_array_length(case when jsonb_typeof(derived -> 'flights') = 'array' then derived -> 'flights' end), 0)) STORED;--> statement-breakpoint

ALTER TABLE "runs" ADD COLUMN "flights_on_signal" boolean GENERATED ALWAYS AS (coalesce((task ->> 'kind') = 'all-up', false)) STORED NOT NULL;