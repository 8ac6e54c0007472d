-- lane_flights follows run_lanes.derived -> 'flights' looking only at the flights that changed
-- against the lane's previous derivation (OLD), and at the one after each (its ground time reads
-- the previous landing). Before, every stored derivation ran an upsert for EVERY flight of the
-- lane, and ON CONFLICT DO UPDATE locks (writes) each existing row even when its WHERE finds nothing
-- to change: a push into a lane of 2,500 flights spent most of its time here. lane_flights equals
-- OLD's flights before the update (this trigger is its only writer), so flights equal in OLD and
-- NEW need no row written.
CREATE OR REPLACE FUNCTION lane_flights_follow() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  nf jsonb := CASE WHEN jsonb_typeof(NEW.derived -> 'flights') = 'array' THEN NEW.derived -> 'flights' ELSE '[]'::jsonb END;
  ofl jsonb := CASE WHEN TG_OP = 'UPDATE' AND jsonb_typeof(OLD.derived -> 'flights') = 'array' THEN OLD.derived -> 'flights' END;
BEGIN
  INSERT INTO lane_flights AS t (run_id, lane, "position", flight_index, launch_ms, land_ms, status, time_tenths, credited_tenths, target_sec, ground_ms)
  SELECT NEW.run_id, NEW.lane, r.* FROM lane_flights_rows(nf) r
  WHERE ofl IS NULL
    OR (ofl -> r."position") IS DISTINCT FROM (nf -> r."position")
    OR (r."position" > 0 AND (ofl -> (r."position" - 1)) IS DISTINCT FROM (nf -> (r."position" - 1)))
  ON CONFLICT (run_id, lane, "position") DO UPDATE SET
    flight_index = excluded.flight_index, launch_ms = excluded.launch_ms, land_ms = excluded.land_ms, status = excluded.status,
    time_tenths = excluded.time_tenths, credited_tenths = excluded.credited_tenths, target_sec = excluded.target_sec, ground_ms = excluded.ground_ms
  WHERE (t.flight_index, t.launch_ms, t.land_ms, t.status, t.time_tenths, t.credited_tenths, t.target_sec, t.ground_ms)
    IS DISTINCT FROM (excluded.flight_index, excluded.launch_ms, excluded.land_ms, excluded.status, excluded.time_tenths, excluded.credited_tenths, excluded.target_sec, excluded.ground_ms);
  DELETE FROM lane_flights t WHERE t.run_id = NEW.run_id AND t.lane = NEW.lane AND t."position" >= jsonb_array_length(nf);
  RETURN NULL;
END $$;
