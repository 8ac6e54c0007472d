ALTER TABLE "run_lanes" ALTER COLUMN "season_max_tenths" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_lost_tenths" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_penalty_points" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_lost_ground_time" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_lost_over_cap" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_lost_short_of_target" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_lost_invalid" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_lost_not_counted" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_lost_round_zero" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_flight_count" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_ground_ms" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_landed_tenths" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_target_sec" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_turnaround_ms" DROP EXPRESSION;--> statement-breakpoint
ALTER TABLE "run_lanes" ALTER COLUMN "season_duration_bins" DROP EXPRESSION;--> statement-breakpoint
-- (hand-written from here) The Season's columns of run_lanes were generated from `derived` (migrations 0036, 0039, 0043):
-- every stored derivation expanded all of a lane's flights five times (~20 ms per push into a 2,900-flight lane), and the
-- lane_flights trigger (0027) extracted and compared them again after the row was written. One BEFORE trigger now keeps
-- both from one comparison of the old and new flights: the per-flight arrays and lane_flights are rewritten only at the
-- positions that changed (a flight that differs, and the one after it: its ground time reads the previous landing), the
-- per-lane aggregates are worked out from the arrays (plain arrays, not JSON). The values are the same as before: a new
-- lane, and an update that changes most of a lane's flights, still go through the functions of 0039 and 0043, which stay
-- the definition (tests/integration/season-lane-incremental.test.ts compares the two). The columns are written only here.
CREATE FUNCTION run_lanes_season_follow() RETURNS trigger
LANGUAGE plpgsql AS $$
DECLARE
  d jsonb := NEW.derived;
  nf jsonb := d -> 'flights';
  ofl jsonb;
  n int;
  old_n int := 0;
  changed int[];
  ground double precision[];
  landed integer[];
  target integer[];
  f jsonb;
  p int;
BEGIN
  NEW.season_max_tenths := (d #>> '{breakdown,maxTenths}')::int;
  NEW.season_lost_tenths := (d #>> '{breakdown,lostTenths}')::int;
  NEW.season_penalty_points := coalesce((d #>> '{breakdown,penaltyPoints}')::int, 0);
  NEW.season_lost_ground_time := coalesce((d #>> '{breakdown,parts,groundTime}')::int, 0);
  NEW.season_lost_over_cap := coalesce((d #>> '{breakdown,parts,overCap}')::int, 0);
  NEW.season_lost_short_of_target := coalesce((d #>> '{breakdown,parts,shortOfTarget}')::int, 0);
  NEW.season_lost_invalid := coalesce((d #>> '{breakdown,parts,invalid}')::int, 0);
  NEW.season_lost_not_counted := coalesce((d #>> '{breakdown,parts,notCounted}')::int, 0);
  NEW.season_lost_round_zero := coalesce((d #>> '{breakdown,parts,roundZero}')::int, 0);
  IF jsonb_typeof(nf) IS DISTINCT FROM 'array' THEN nf := '[]'::jsonb; END IF;
  n := jsonb_array_length(nf);
  NEW.season_flight_count := n;
  IF TG_OP = 'UPDATE' THEN
    ofl := OLD.derived -> 'flights';
    IF jsonb_typeof(ofl) = 'array' THEN old_n := jsonb_array_length(ofl); ELSE ofl := NULL; END IF;
    -- the positions whose flight differs, and the position after each (one comparison per flight)
    SELECT array_agg(DISTINCT v.q ORDER BY v.q) INTO changed
    FROM generate_series(0, n - 1) AS i, LATERAL (VALUES (i), (i + 1)) AS v(q)
    WHERE (ofl -> i) IS DISTINCT FROM (nf -> i) AND v.q < n;
    IF changed IS NOT NULL THEN
      INSERT INTO lane_flights AS t (run_id, lane, "position", flight_index, launch_ms, land_ms, status, time_tenths, credited_tenths, target_sec, ground_ms)
      SELECT NEW.run_id, NEW.lane, r.* FROM lane_flights_rows_at(nf, changed) r
      ON CONFLICT (run_id, lane, "position") DO UPDATE SET
        flight_index = excluded.flight_index, launch_ms = excluded.launch_ms, land_ms = excluded.land_ms, status = excluded.status,
        time_tenths = excluded.time_tenths, credited_tenths = excluded.credited_tenths, target_sec = excluded.target_sec, ground_ms = excluded.ground_ms
      WHERE (t.flight_index, t.launch_ms, t.land_ms, t.status, t.time_tenths, t.credited_tenths, t.target_sec, t.ground_ms)
        IS DISTINCT FROM (excluded.flight_index, excluded.launch_ms, excluded.land_ms, excluded.status, excluded.time_tenths, excluded.credited_tenths, excluded.target_sec, excluded.ground_ms);
    END IF;
    DELETE FROM lane_flights t WHERE t.run_id = NEW.run_id AND t.lane = NEW.lane AND t."position" >= n;
    IF changed IS NULL AND n = old_n THEN
      -- no flight changed: the arrays and aggregates stay as they are
      NEW.season_ground_ms := OLD.season_ground_ms;
      NEW.season_landed_tenths := OLD.season_landed_tenths;
      NEW.season_target_sec := OLD.season_target_sec;
      NEW.season_turnaround_ms := OLD.season_turnaround_ms;
      NEW.season_duration_bins := OLD.season_duration_bins;
      RETURN NEW;
    END IF;
    IF n > 0 AND coalesce(cardinality(changed), 0) * 2 <= n THEN
      -- the old arrays cut to the new length, then the changed positions written (in order, so an array grows without gaps)
      ground := coalesce(OLD.season_ground_ms[1:n], '{}');
      landed := coalesce(OLD.season_landed_tenths[1:n], '{}');
      target := coalesce(OLD.season_target_sec[1:n], array_fill(NULL::int, ARRAY[least(n, old_n)]));
      FOREACH p IN ARRAY coalesce(changed, '{}') LOOP
        f := nf -> p;
        ground[p + 1] := CASE WHEN p > 0 THEN (f ->> 'launchMs')::float8 - ((nf -> (p - 1)) ->> 'landMs')::float8 END;
        landed[p + 1] := CASE WHEN f ->> 'landMs' IS NOT NULL THEN (f ->> 'timeTenths')::int END;
        target[p + 1] := (f ->> 'targetSec')::int;
      END LOOP;
      NEW.season_ground_ms := ground;
      NEW.season_landed_tenths := landed;
      NEW.season_target_sec := CASE WHEN EXISTS (SELECT 1 FROM unnest(target) AS t(s) WHERE t.s IS NOT NULL) THEN target END;
      NEW.season_turnaround_ms := (SELECT array_agg(g.ms ORDER BY g.p) FILTER (WHERE g.ms >= 0) FROM unnest(ground) WITH ORDINALITY AS g(ms, p));
      NEW.season_duration_bins := (SELECT array_agg(coalesce(c.flights, 0) ORDER BY b.bin) FROM generate_series(0, 10) AS b(bin)
        LEFT JOIN (SELECT least(t.tenths / 300, 10) AS bin, count(*)::int AS flights FROM unnest(landed) AS t(tenths) WHERE t.tenths IS NOT NULL GROUP BY 1) c
        ON c.bin = b.bin);
      RETURN NEW;
    END IF;
  END IF;
  -- a new lane, or most of its flights changed: the definitions themselves
  NEW.season_ground_ms := season_flight_ground_ms(d);
  NEW.season_landed_tenths := season_flight_landed_tenths(d);
  NEW.season_target_sec := season_flight_target_sec(d);
  NEW.season_turnaround_ms := season_flight_turnaround_ms(d);
  NEW.season_duration_bins := season_flight_duration_bins(d);
  RETURN NEW;
END $$;
--> statement-breakpoint
CREATE TRIGGER run_lanes_season_on_write BEFORE INSERT OR UPDATE OF derived ON run_lanes FOR EACH ROW EXECUTE FUNCTION run_lanes_season_follow();
--> statement-breakpoint
-- lane_flights of an update now follow in run_lanes_season_follow (a new lane's still in lane_flights_follow, after the insert)
DROP TRIGGER lane_flights_on_update ON run_lanes;
