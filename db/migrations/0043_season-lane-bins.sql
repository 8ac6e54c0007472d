-- Per-lane aggregates the Season's summary sums instead of unnesting each of the season's flights (30,000 in the
-- bench), kept by PostgreSQL from run_lanes.derived (generated, stored: every stored derivation refreshes them, and
-- adding the columns computes them for the lanes already there, so no separate backfill is needed).
-- The lane's turnarounds: the ground times of season_flight_ground_ms (migration 0039, = lane_flights.ground_ms:
-- launch minus the previous flight's landing) that are known and not negative, in flight order; null when none.
-- This is db/queries/season/turnaround.ts isTurnaround without the task's part (flights launched on signals),
-- which the summary applies per lane.
CREATE FUNCTION season_flight_turnaround_ms(derived jsonb) RETURNS double precision[]
LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
  SELECT array_agg(g.ground_ms ORDER BY g.p) FILTER (WHERE g.ground_ms >= 0) FROM (
    SELECT f.p, (f.e ->> 'launchMs')::float8 - lag((f.e ->> 'landMs')::float8) OVER (ORDER BY f.p) AS ground_ms
    FROM jsonb_array_elements(CASE WHEN jsonb_typeof(derived -> 'flights') = 'array' THEN derived -> 'flights' ELSE '[]'::jsonb END) WITH ORDINALITY AS f(e, p)
  ) g
$$;
--> statement-breakpoint
-- The lane's landed flights counted in the duration histogram's bins: 11 counts, bin k holding the flights of
-- k × 30 s up to (k + 1) × 30 s, the last (300 s and longer) open (DURATION_BIN_SEC and LAST_DURATION_BIN in
-- db/queries/season/scope.ts: keep them in step). Zeros for a lane with no landed flight.
CREATE FUNCTION season_flight_duration_bins(derived jsonb) RETURNS integer[]
LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
  SELECT array_agg(coalesce(n.flights, 0) ORDER BY b.bin) FROM generate_series(0, 10) AS b(bin)
  LEFT JOIN (
    SELECT least((f.e ->> 'timeTenths')::int / 300, 10) AS bin, count(*)::int AS flights
    FROM jsonb_array_elements(CASE WHEN jsonb_typeof(derived -> 'flights') = 'array' THEN derived -> 'flights' ELSE '[]'::jsonb END) AS f(e)
    WHERE f.e ->> 'landMs' IS NOT NULL
    GROUP BY 1
  ) n ON n.bin = b.bin
$$;
--> statement-breakpoint
-- one ALTER so the table is rewritten once
ALTER TABLE "run_lanes"
  ADD COLUMN "season_turnaround_ms" double precision[] GENERATED ALWAYS AS (season_flight_turnaround_ms(derived)) STORED,
  ADD COLUMN "season_duration_bins" integer[] GENERATED ALWAYS AS (season_flight_duration_bins(derived)) STORED;
