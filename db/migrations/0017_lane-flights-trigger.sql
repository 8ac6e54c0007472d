-- lane_flights follows run_lanes.derived -> 'flights' (db/schema/lane-flights.ts): whatever code
-- stores a lane's derivation, this trigger writes the flights that are new or changed and deletes
-- the ones past the new end; unchanged flights are not touched.
CREATE FUNCTION lane_flights_rows(flights jsonb)
RETURNS TABLE ("position" int, flight_index int, launch_ms float8, land_ms float8, status text, time_tenths int, credited_tenths int, target_sec int, ground_ms float8)
LANGUAGE sql IMMUTABLE AS $$
  SELECT (f.ord - 1)::int, f."index", f."launchMs", f."landMs", f.status, f."timeTenths", f."creditedTenths", f."targetSec",
    -- the derived flights are in flight order: the previous landing is the array's previous element
    CASE WHEN f.ord > 1 THEN f."launchMs" - (flights -> (f.ord::int - 2) ->> 'landMs')::float8 END
  FROM ROWS FROM (jsonb_to_recordset(CASE WHEN jsonb_typeof(flights) = 'array' THEN flights ELSE '[]'::jsonb END)
    AS ("index" int, "launchMs" float8, "landMs" float8, status text, "timeTenths" int, "creditedTenths" int, "targetSec" int)) WITH ORDINALITY
    AS f("index", "launchMs", "landMs", status, "timeTenths", "creditedTenths", "targetSec", ord)
$$;
--> statement-breakpoint
CREATE FUNCTION lane_flights_follow() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO lane_flights AS t (run_id, lane, "position", flight_index, launch_ms, land_ms, status, time_tenths, credited_tenths, target_sec, ground_ms)
  SELECT NEW.run_id, NEW.lane, r.* FROM lane_flights_rows(NEW.derived -> 'flights') r
  ON CONFLICT (run_id, lane, "position") DO UPDATE SET
    flight_index = excluded.flight_index, launch_ms = excluded.launch_ms, land_ms = excluded.land_ms, status = excluded.status,
    time_tenths = excluded.time_tenths, credited_tenths = excluded.credited_tenths, target_sec = excluded.target_sec, ground_ms = excluded.ground_ms
  WHERE (t.flight_index, t.launch_ms, t.land_ms, t.status, t.time_tenths, t.credited_tenths, t.target_sec, t.ground_ms)
    IS DISTINCT FROM (excluded.flight_index, excluded.launch_ms, excluded.land_ms, excluded.status, excluded.time_tenths, excluded.credited_tenths, excluded.target_sec, excluded.ground_ms);
  DELETE FROM lane_flights t WHERE t.run_id = NEW.run_id AND t.lane = NEW.lane
    AND t."position" >= CASE WHEN jsonb_typeof(NEW.derived -> 'flights') = 'array' THEN jsonb_array_length(NEW.derived -> 'flights') ELSE 0 END;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER lane_flights_on_insert AFTER INSERT ON run_lanes FOR EACH ROW EXECUTE FUNCTION lane_flights_follow();
--> statement-breakpoint
CREATE TRIGGER lane_flights_on_update AFTER UPDATE OF derived ON run_lanes FOR EACH ROW
  WHEN (OLD.derived -> 'flights' IS DISTINCT FROM NEW.derived -> 'flights') EXECUTE FUNCTION lane_flights_follow();
--> statement-breakpoint
INSERT INTO lane_flights (run_id, lane, "position", flight_index, launch_ms, land_ms, status, time_tenths, credited_tenths, target_sec, ground_ms)
SELECT l.run_id, l.lane, r.* FROM run_lanes l CROSS JOIN LATERAL lane_flights_rows(l.derived -> 'flights') r;
