-- lane_flights follows run_lanes.derived -> 'flights' as 0024 made it (only the flights that changed
-- against OLD, and the one after each), finding them cheaply: one pass comparing the two arrays
-- element by element, then only those positions expanded to rows. 0024 expanded every flight of the
-- lane into a row before filtering: on a lane of 2,500 flights (a 5,000-event run) that was ~85 ms of
-- each push's ~100 ms in this trigger, against ~2 ms for the comparison (measured in a DO block).
CREATE FUNCTION lane_flights_rows_at(flights jsonb, positions int[])
RETURNS TABLE("position" integer, flight_index integer, launch_ms double precision, land_ms double precision, status text,
  time_tenths integer, credited_tenths integer, target_sec integer, ground_ms double precision)
LANGUAGE sql IMMUTABLE AS $$
  SELECT p, f."index", f."launchMs", f."landMs", f.status, f."timeTenths", f."creditedTenths", f."targetSec",
    -- the derived flights are in flight order: the previous landing is the array's previous element
    CASE WHEN p > 0 THEN f."launchMs" - (flights -> (p - 1) ->> 'landMs')::float8 END
  FROM unnest(positions) AS p,
    jsonb_to_record(flights -> p) AS f("index" int, "launchMs" float8, "landMs" float8, status text, "timeTenths" int, "creditedTenths" int, "targetSec" int)
$$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION lane_flights_follow() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  nf jsonb := CASE WHEN jsonb_typeof(NEW.derived -> 'flights') = 'array' THEN NEW.derived -> 'flights' ELSE '[]'::jsonb END;
  ofl jsonb := CASE WHEN TG_OP = 'UPDATE' AND jsonb_typeof(OLD.derived -> 'flights') = 'array' THEN OLD.derived -> 'flights' END;
  changed int[];
BEGIN
  IF ofl IS NULL THEN
    SELECT array_agg(i ORDER BY i) INTO changed FROM generate_series(0, jsonb_array_length(nf) - 1) AS i;
  ELSE
    SELECT array_agg(i ORDER BY i) INTO changed FROM generate_series(0, jsonb_array_length(nf) - 1) AS i
    WHERE (ofl -> i) IS DISTINCT FROM (nf -> i) OR (i > 0 AND (ofl -> (i - 1)) IS DISTINCT FROM (nf -> (i - 1)));
  END IF;
  IF changed IS NOT NULL THEN
    INSERT INTO lane_flights AS t (run_id, lane, "position", flight_index, launch_ms, land_ms, status, time_tenths, credited_tenths, target_sec, ground_ms)
    SELECT NEW.run_id, NEW.lane, r.* FROM lane_flights_rows_at(nf, changed) r
    ON CONFLICT (run_id, lane, "position") DO UPDATE SET
      flight_index = excluded.flight_index, launch_ms = excluded.launch_ms, land_ms = excluded.land_ms, status = excluded.status,
      time_tenths = excluded.time_tenths, credited_tenths = excluded.credited_tenths, target_sec = excluded.target_sec, ground_ms = excluded.ground_ms
    WHERE (t.flight_index, t.launch_ms, t.land_ms, t.status, t.time_tenths, t.credited_tenths, t.target_sec, t.ground_ms)
      IS DISTINCT FROM (excluded.flight_index, excluded.launch_ms, excluded.land_ms, excluded.status, excluded.time_tenths, excluded.credited_tenths, excluded.target_sec, excluded.ground_ms);
  END IF;
  DELETE FROM lane_flights t WHERE t.run_id = NEW.run_id AND t.lane = NEW.lane AND t."position" >= jsonb_array_length(nf);
  RETURN NULL;
END $$;
--> statement-breakpoint
DROP TRIGGER lane_flights_on_update ON run_lanes;--> statement-breakpoint
CREATE TRIGGER lane_flights_on_update AFTER UPDATE OF derived ON run_lanes FOR EACH ROW EXECUTE FUNCTION lane_flights_follow();
