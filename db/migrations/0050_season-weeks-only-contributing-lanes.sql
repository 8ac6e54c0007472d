-- The weekly turnarounds (season_week_turnarounds) are worked out again only for the lanes that count in them:
-- a lane adds to its pilot's week only when it has a result and at least one turnaround (season_week_turnarounds_of:
-- result_tenths IS NOT NULL, one row per element of season_turnaround_ms). A lane inserted without a result (every new
-- run's lanes, before its first derivation) or with no turnaround changes no week, so it no longer re-reads one; an
-- update refreshes the old row's week when the old row counted and the new row's when the new row counts.
CREATE OR REPLACE FUNCTION season_week_turnarounds_follow_lanes() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM season_week_turnarounds_refresh(array_agg(n.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM new_rows n JOIN runs r ON r.id = n.run_id
    WHERE n.pilot_user_id IS NOT NULL AND n.result_tenths IS NOT NULL AND cardinality(n.season_turnaround_ms) > 0;
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM season_week_turnarounds_refresh(array_agg(o.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM old_rows o JOIN runs r ON r.id = o.run_id
    WHERE o.pilot_user_id IS NOT NULL AND o.result_tenths IS NOT NULL AND cardinality(o.season_turnaround_ms) > 0;
  ELSE
    PERFORM season_week_turnarounds_refresh(array_agg(k.pilot), array_agg(season_week_of(r.created_at)))
    FROM (
      SELECT o.run_id, o.pilot_user_id AS pilot FROM old_rows o JOIN new_rows n ON n.run_id = o.run_id AND n.lane = o.lane
      WHERE (o.pilot_user_id, o.result_tenths, o.season_turnaround_ms) IS DISTINCT FROM (n.pilot_user_id, n.result_tenths, n.season_turnaround_ms)
        AND o.result_tenths IS NOT NULL AND cardinality(o.season_turnaround_ms) > 0
      UNION ALL
      SELECT n.run_id, n.pilot_user_id FROM old_rows o JOIN new_rows n ON n.run_id = o.run_id AND n.lane = o.lane
      WHERE (o.pilot_user_id, o.result_tenths, o.season_turnaround_ms) IS DISTINCT FROM (n.pilot_user_id, n.result_tenths, n.season_turnaround_ms)
        AND n.result_tenths IS NOT NULL AND cardinality(n.season_turnaround_ms) > 0
    ) k JOIN runs r ON r.id = k.run_id WHERE k.pilot IS NOT NULL;
  END IF;
  RETURN NULL;
END $$;
