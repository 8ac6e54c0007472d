CREATE TABLE "season_week_stale" (
	"pilot_user_id" uuid NOT NULL,
	"week" date NOT NULL,
	"xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL,
	CONSTRAINT "season_week_stale_pilot_user_id_week_xid_pk" PRIMARY KEY("pilot_user_id","week","xid")
);
--> statement-breakpoint
-- The weekly turnarounds (season_week_turnarounds) are no longer worked out again inside the write that changes them:
-- the triggers on run_lanes, runs and lane_consents (migrations "season-week-turnarounds-triggers",
-- "season-weeks-only-contributing-lanes": the same conditions) now only mark the (pilot, week) pairs they used to refresh,
-- one row each in season_week_stale keyed by the writing transaction; the Season's reader settles a pilot's marked weeks
-- (season_week_turnarounds_settle, db/queries/season/weeks.ts) before it reads, and reads a week still marked from its
-- lanes (db/queries/season/summary.ts). A push no longer re-reads its pilot's whole week (issue #11: ~3.1 of the crowd's
-- 9.2 s of statement time).
--
-- Why the writer's transaction id is in the key: with one mark per (pilot, week), a push finding a committed mark would
-- add none, a reader could then delete that mark and refresh the week before the push commits (not seeing its lane),
-- and the push's change would be left with no mark. A push's own mark cannot be deleted by anyone before it commits.
-- Marks the given (pilot, week) pairs (the arrays zipped; pairs with a null are ignored) stale for this transaction.
CREATE FUNCTION season_week_turnarounds_mark(pilots uuid[], weeks date[]) RETURNS void
LANGUAGE plpgsql AS $$
BEGIN
  IF pilots IS NULL OR cardinality(pilots) = 0 THEN RETURN; END IF;
  INSERT INTO season_week_stale (pilot_user_id, week)
  SELECT DISTINCT u.pilot, u.week FROM unnest(pilots, weeks) u(pilot, week) WHERE u.pilot IS NOT NULL AND u.week IS NOT NULL
  ON CONFLICT DO NOTHING;
END $$;
--> statement-breakpoint
-- Works out again the marked weeks of the given pilots, deleting the marks it saw: the marks are deleted first (this
-- statement's snapshot: every write they stand for has committed), then season_week_turnarounds_refresh takes each
-- week's advisory lock and reads its lanes in a later snapshot, which holds those writes. A write not committed when the
-- marks were deleted keeps its own mark (invisible to the delete), so its week is worked out again by a later reader.
CREATE FUNCTION season_week_turnarounds_settle(pilots uuid[]) RETURNS void
LANGUAGE plpgsql AS $$
DECLARE
  ps uuid[];
  ws date[];
BEGIN
  WITH gone AS (DELETE FROM season_week_stale WHERE pilot_user_id = ANY (pilots) RETURNING pilot_user_id, week)
  SELECT array_agg(pilot_user_id), array_agg(week) INTO ps, ws FROM gone;
  PERFORM season_week_turnarounds_refresh(ps, ws);
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION season_week_turnarounds_follow_lanes() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM season_week_turnarounds_mark(array_agg(n.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM new_rows n JOIN runs r ON r.id = n.run_id
    WHERE n.pilot_user_id IS NOT NULL AND n.result_tenths IS NOT NULL AND cardinality(n.season_turnaround_ms) > 0;
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM season_week_turnarounds_mark(array_agg(o.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM old_rows o JOIN runs r ON r.id = o.run_id
    WHERE o.pilot_user_id IS NOT NULL AND o.result_tenths IS NOT NULL AND cardinality(o.season_turnaround_ms) > 0;
  ELSE
    PERFORM season_week_turnarounds_mark(array_agg(k.pilot), array_agg(season_week_of(r.created_at)))
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
--> statement-breakpoint
CREATE OR REPLACE FUNCTION season_week_turnarounds_follow_runs() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    PERFORM season_week_turnarounds_mark(array_agg(s.pilot_user_id), array_agg(s.week))
    FROM season_week_turnarounds s WHERE s.week IN (SELECT season_week_of(o.created_at) FROM old_rows o);
  ELSE
    PERFORM season_week_turnarounds_mark(array_agg(l.pilot_user_id), array_agg(w.week))
    FROM old_rows o JOIN new_rows n ON n.id = o.id
    JOIN run_lanes l ON l.run_id = n.id
    CROSS JOIN LATERAL (VALUES (season_week_of(o.created_at)), (season_week_of(n.created_at))) w(week)
    WHERE (o.created_at, o.created_by, o.flights_on_signal) IS DISTINCT FROM (n.created_at, n.created_by, n.flights_on_signal)
      AND l.pilot_user_id IS NOT NULL;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION season_week_turnarounds_follow_consents() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM season_week_turnarounds_mark(array_agg(l.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM new_rows n JOIN run_lanes l ON l.run_id = n.run_id AND l.lane = n.lane JOIN runs r ON r.id = n.run_id;
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM season_week_turnarounds_mark(array_agg(l.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM old_rows o JOIN run_lanes l ON l.run_id = o.run_id AND l.lane = o.lane JOIN runs r ON r.id = o.run_id;
  ELSE
    PERFORM season_week_turnarounds_mark(array_agg(l.pilot_user_id), array_agg(season_week_of(r.created_at)))
    FROM (SELECT run_id, lane FROM old_rows UNION SELECT run_id, lane FROM new_rows) k
    JOIN run_lanes l ON l.run_id = k.run_id AND l.lane = k.lane JOIN runs r ON r.id = k.run_id;
  END IF;
  RETURN NULL;
END $$;
