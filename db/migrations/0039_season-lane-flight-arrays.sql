-- The Season's per-flight inputs as arrays on each lane, kept by PostgreSQL from run_lanes.derived (generated,
-- stored): the summary unnests them from the lanes it reads instead of fetching every lane's lane_flights rows
-- by key (30,000 in the bench). Each element is the lane's flight at that position, equal to lane_flights
-- (migration 0027, lane_flights_rows_at): ground_ms is the launch minus the previous flight's landing.
-- (the previous landing by lag over one expansion of the flights: indexing the array per flight re-extracts it
-- each time, 545 ms on a lane of 2,500 flights against a few ms)
CREATE FUNCTION season_flight_ground_ms(derived jsonb) RETURNS double precision[]
LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
  SELECT array_agg(g.ground_ms ORDER BY g.p) FROM (
    SELECT f.p, (f.e ->> 'launchMs')::float8 - lag((f.e ->> 'landMs')::float8) OVER (ORDER BY f.p) AS ground_ms
    FROM jsonb_array_elements(CASE WHEN jsonb_typeof(derived -> 'flights') = 'array' THEN derived -> 'flights' ELSE '[]'::jsonb END) WITH ORDINALITY AS f(e, p)
  ) g
$$;
--> statement-breakpoint
-- each flight's duration (tenths) when it landed, else null
CREATE FUNCTION season_flight_landed_tenths(derived jsonb) RETURNS integer[]
LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
  SELECT array_agg(CASE WHEN f.e ->> 'landMs' IS NOT NULL THEN (f.e ->> 'timeTenths')::int END ORDER BY f.p)
  FROM jsonb_array_elements(CASE WHEN jsonb_typeof(derived -> 'flights') = 'array' THEN derived -> 'flights' ELSE '[]'::jsonb END) WITH ORDINALITY AS f(e, p)
$$;
--> statement-breakpoint
-- each flight's target (seconds); null as a whole when no flight of the lane has one, so the Season skips the lane
CREATE FUNCTION season_flight_target_sec(derived jsonb) RETURNS integer[]
LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
  SELECT CASE WHEN count(f.e ->> 'targetSec') > 0 THEN array_agg((f.e ->> 'targetSec')::int ORDER BY f.p) END
  FROM jsonb_array_elements(CASE WHEN jsonb_typeof(derived -> 'flights') = 'array' THEN derived -> 'flights' ELSE '[]'::jsonb END) WITH ORDINALITY AS f(e, p)
$$;
--> statement-breakpoint
-- one ALTER so the table is rewritten once
ALTER TABLE "run_lanes"
  ADD COLUMN "season_ground_ms" double precision[] GENERATED ALWAYS AS (season_flight_ground_ms(derived)) STORED,
  ADD COLUMN "season_landed_tenths" integer[] GENERATED ALWAYS AS (season_flight_landed_tenths(derived)) STORED,
  ADD COLUMN "season_target_sec" integer[] GENERATED ALWAYS AS (season_flight_target_sec(derived)) STORED;
