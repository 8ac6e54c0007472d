-- season_week_turnarounds (db/schema/season-weeks.ts): each pilot's turnarounds per week (count, median, 90th percentile), kept by PostgreSQL
-- from run_lanes, runs and lane_consents whatever code writes them (push, re-derivation, deletions, consent decisions).
-- A week's row is worked out again from its lanes (never adjusted by differences, so it cannot drift): the lanes in the
-- Season's scope (db/queries/season/scope.ts: the pilot's, on a run they created or whose lane they accepted, with a
-- result) on a task not launched on signals (db/queries/season/turnaround.ts), their run_lanes.season_turnaround_ms.

-- The Monday (UTC) of the week of a run's creation, as db/queries/season/scope.ts weekOf works it out.
CREATE FUNCTION season_week_of(at timestamptz) RETURNS date
LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$ SELECT (date_trunc('week', at AT TIME ZONE 'UTC'))::date $$;
--> statement-breakpoint
-- A pilot's turnarounds in a week: how many, and their median and 90th percentile in ms as percentile_cont gives them
-- (the summary's own aggregate with a filter: db/queries/season/summary.ts); no row when none. The one definition the rows
-- are worked out by.
CREATE FUNCTION season_week_turnarounds_of(pilot uuid, week date) RETURNS TABLE (turnarounds integer, p double precision[])
LANGUAGE sql STABLE AS $$
  SELECT count(*)::int, percentile_cont(array[0.5, 0.9]) WITHIN GROUP (ORDER BY t.ms)
  FROM runs r
  JOIN run_lanes l ON l.run_id = r.id AND l.pilot_user_id = pilot
  LEFT JOIN lane_consents c ON c.run_id = l.run_id AND c.lane = l.lane
  CROSS JOIN unnest(l.season_turnaround_ms) AS t(ms)
  WHERE r.created_at >= (week::timestamp AT TIME ZONE 'UTC') AND r.created_at < ((week + 7)::timestamp AT TIME ZONE 'UTC')
    AND l.result_tenths IS NOT NULL AND (r.created_by = pilot OR c.status = 'accepted') AND NOT r.flights_on_signal
  HAVING count(*) > 0
$$;
--> statement-breakpoint
-- Works out again the rows of the given (pilot, week) pairs (the arrays zipped; pairs with a null are ignored). One
-- writer per pair at a time (a transaction-scoped advisory lock, taken in key order), and the rows read after the lock:
-- two pushes changing lanes of the same pilot and week cannot each store a week without the other's lane.
CREATE FUNCTION season_week_turnarounds_refresh(pilots uuid[], weeks date[]) RETURNS void
LANGUAGE plpgsql AS $$
BEGIN
  IF pilots IS NULL OR cardinality(pilots) = 0 THEN RETURN; END IF;
  PERFORM pg_advisory_xact_lock(hashtextextended('season_week_turnarounds/' || k.pilot || '/' || k.week, 0))
  FROM (SELECT DISTINCT u.pilot, u.week FROM unnest(pilots, weeks) u(pilot, week) WHERE u.pilot IS NOT NULL AND u.week IS NOT NULL ORDER BY 1, 2) k;
  WITH k AS (
    SELECT DISTINCT u.pilot, u.week FROM unnest(pilots, weeks) u(pilot, week) WHERE u.pilot IS NOT NULL AND u.week IS NOT NULL
  ), fresh AS (
    SELECT k.pilot, k.week, x.turnarounds, x.p FROM k LEFT JOIN LATERAL season_week_turnarounds_of(k.pilot, k.week) x ON true
  ), gone AS (
    DELETE FROM season_week_turnarounds s USING fresh f
    WHERE s.pilot_user_id = f.pilot AND s.week = f.week AND f.turnarounds IS NULL
  )
  INSERT INTO season_week_turnarounds AS s (pilot_user_id, week, turnarounds, median_ms, p90_ms)
  SELECT f.pilot, f.week, f.turnarounds, f.p[1], f.p[2] FROM fresh f WHERE f.turnarounds IS NOT NULL
  ON CONFLICT (pilot_user_id, week) DO UPDATE SET turnarounds = excluded.turnarounds, median_ms = excluded.median_ms, p90_ms = excluded.p90_ms
  WHERE (s.turnarounds, s.median_ms, s.p90_ms) IS DISTINCT FROM (excluded.turnarounds, excluded.median_ms, excluded.p90_ms);
END $$;
--> statement-breakpoint
-- run_lanes: the weeks of the lanes inserted, deleted, or changed in what the week reads (pilot, result, turnarounds).
-- A lane deleted with its run (no run left to date it) is left to the trigger on runs.
CREATE FUNCTION season_week_turnarounds_follow_lanes() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM season_week_turnarounds_refresh(array_agg(n.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM new_rows n JOIN runs r ON r.id = n.run_id WHERE n.pilot_user_id IS NOT NULL;
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM season_week_turnarounds_refresh(array_agg(o.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM old_rows o JOIN runs r ON r.id = o.run_id WHERE o.pilot_user_id IS NOT NULL;
  ELSE
    PERFORM season_week_turnarounds_refresh(array_agg(k.pilot), array_agg(season_week_of(r.created_at)))
    FROM (
      SELECT o.run_id, o.pilot_user_id AS pilot FROM old_rows o JOIN new_rows n ON n.run_id = o.run_id AND n.lane = o.lane
      WHERE (o.pilot_user_id, o.result_tenths, o.season_turnaround_ms) IS DISTINCT FROM (n.pilot_user_id, n.result_tenths, n.season_turnaround_ms)
      UNION ALL
      SELECT n.run_id, n.pilot_user_id FROM old_rows o JOIN new_rows n ON n.run_id = o.run_id AND n.lane = o.lane
      WHERE (o.pilot_user_id, o.result_tenths, o.season_turnaround_ms) IS DISTINCT FROM (n.pilot_user_id, n.result_tenths, n.season_turnaround_ms)
    ) k JOIN runs r ON r.id = k.run_id WHERE k.pilot IS NOT NULL;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
-- runs: a run whose day, creator or task kind changed moves its lanes' turnarounds (old and new week); a deleted run
-- (its lanes deleted with it) changes the weeks it was in, for every pilot with a row there.
CREATE FUNCTION season_week_turnarounds_follow_runs() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    PERFORM season_week_turnarounds_refresh(array_agg(s.pilot_user_id), array_agg(s.week))
    FROM season_week_turnarounds s WHERE s.week IN (SELECT season_week_of(o.created_at) FROM old_rows o);
  ELSE
    PERFORM season_week_turnarounds_refresh(array_agg(l.pilot_user_id), array_agg(w.week))
    FROM old_rows o JOIN new_rows n ON n.id = o.id
    JOIN run_lanes l ON l.run_id = n.id
    CROSS JOIN LATERAL (VALUES (season_week_of(o.created_at)), (season_week_of(n.created_at))) w(week)
    WHERE (o.created_at, o.created_by, o.flights_on_signal) IS DISTINCT FROM (n.created_at, n.created_by, n.flights_on_signal)
      AND l.pilot_user_id IS NOT NULL;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
-- lane_consents: a decision on a lane recorded for its pilot (accepted counts, anything else does not).
CREATE FUNCTION season_week_turnarounds_follow_consents() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM season_week_turnarounds_refresh(array_agg(l.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM new_rows n JOIN run_lanes l ON l.run_id = n.run_id AND l.lane = n.lane JOIN runs r ON r.id = n.run_id;
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM season_week_turnarounds_refresh(array_agg(l.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM old_rows o JOIN run_lanes l ON l.run_id = o.run_id AND l.lane = o.lane JOIN runs r ON r.id = o.run_id;
  ELSE
    PERFORM season_week_turnarounds_refresh(array_agg(l.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM (SELECT run_id, lane FROM old_rows UNION SELECT run_id, lane FROM new_rows) k
    JOIN run_lanes l ON l.run_id = k.run_id AND l.lane = k.lane JOIN runs r ON r.id = k.run_id;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER season_week_turnarounds_lanes_insert AFTER INSERT ON run_lanes REFERENCING NEW TABLE AS new_rows
  FOR EACH STATEMENT EXECUTE FUNCTION season_week_turnarounds_follow_lanes();
--> statement-breakpoint
CREATE TRIGGER season_week_turnarounds_lanes_update AFTER UPDATE ON run_lanes REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows
  FOR EACH STATEMENT EXECUTE FUNCTION season_week_turnarounds_follow_lanes();
--> statement-breakpoint
CREATE TRIGGER season_week_turnarounds_lanes_delete AFTER DELETE ON run_lanes REFERENCING OLD TABLE AS old_rows
  FOR EACH STATEMENT EXECUTE FUNCTION season_week_turnarounds_follow_lanes();
--> statement-breakpoint
CREATE TRIGGER season_week_turnarounds_runs_update AFTER UPDATE ON runs REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows
  FOR EACH STATEMENT EXECUTE FUNCTION season_week_turnarounds_follow_runs();
--> statement-breakpoint
CREATE TRIGGER season_week_turnarounds_runs_delete AFTER DELETE ON runs REFERENCING OLD TABLE AS old_rows
  FOR EACH STATEMENT EXECUTE FUNCTION season_week_turnarounds_follow_runs();
--> statement-breakpoint
CREATE TRIGGER season_week_turnarounds_consents_insert AFTER INSERT ON lane_consents REFERENCING NEW TABLE AS new_rows
  FOR EACH STATEMENT EXECUTE FUNCTION season_week_turnarounds_follow_consents();
--> statement-breakpoint
CREATE TRIGGER season_week_turnarounds_consents_update AFTER UPDATE ON lane_consents REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows
  FOR EACH STATEMENT EXECUTE FUNCTION season_week_turnarounds_follow_consents();
--> statement-breakpoint
CREATE TRIGGER season_week_turnarounds_consents_delete AFTER DELETE ON lane_consents REFERENCING OLD TABLE AS old_rows
  FOR EACH STATEMENT EXECUTE FUNCTION season_week_turnarounds_follow_consents();
--> statement-breakpoint
-- the weeks already there (one statement, no per-week locks: nothing else writes while the migration runs)
INSERT INTO season_week_turnarounds (pilot_user_id, week, turnarounds, median_ms, p90_ms)
SELECT w.pilot, w.week, x.turnarounds, x.p[1], x.p[2] FROM (
  SELECT DISTINCT l.pilot_user_id AS pilot, season_week_of(r.created_at) AS week
  FROM run_lanes l JOIN runs r ON r.id = l.run_id WHERE l.pilot_user_id IS NOT NULL
) w CROSS JOIN LATERAL season_week_turnarounds_of(w.pilot, w.week) x;
