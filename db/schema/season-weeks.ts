import { date, doublePrecision, integer, pgTable, primaryKey, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";
import { writtenByXact } from "./xid";

/**
 * Each pilot's turnarounds per week (Monday, UTC, of the run's day): how many, their median and 90th percentile
 * in ms (percentile_cont, as the summary computes them with a filter), which the Season's summary without filters
 * reads (db/queries/season/summary.ts) instead of sorting every turnaround of the season. Kept by PostgreSQL triggers on
 * run_lanes, runs and lane_consents (migration "season-week-turnarounds-triggers"), whatever code writes them:
 * a write marks the (pilot, week) it changes in season_week_stale (migration "season-weeks-marked-stale"), and the
 * Season's reader works the marked weeks out again from their lanes before it reads (db/queries/season/weeks.ts).
 * A lane counts as in the season's scope (db/queries/season/scope.ts: the pilot's, created by them or
 * accepted, with a result) on a task not launched on signals; its values are run_lanes.season_turnaround_ms.
 * Weeks with no turnaround have no row. tests/integration/season-week-turnarounds.test.ts compares the
 * rows with values computed from lane_flights through isTurnaround.
 */
export const seasonWeekTurnarounds = pgTable(
  "season_week_turnarounds",
  {
    pilotUserId: uuid("pilot_user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    week: date("week").notNull(),
    turnarounds: integer("turnarounds").notNull(),
    medianMs: doublePrecision("median_ms").notNull(),
    p90Ms: doublePrecision("p90_ms").notNull(),
  },
  (t) => [primaryKey({ columns: [t.pilotUserId, t.week] })],
);

/**
 * The (pilot, week) pairs whose season_week_turnarounds row may be out of date: the triggers on run_lanes, runs and
 * lane_consents insert one per writing transaction (`xid`, the writer's transaction id, in the key: a writer never relies
 * on a mark another transaction set, which a reader could delete before the writer commits). Readers delete the marks
 * they see and work those weeks out again (season_week_turnarounds_settle); a week with a mark is read from its lanes.
 * No foreign key: a pilot's account deleted leaves nothing to refresh, and a mark must not fail a cascade.
 */
export const seasonWeekStale = pgTable(
  "season_week_stale",
  {
    pilotUserId: uuid("pilot_user_id").notNull(),
    week: date("week").notNull(),
    xid: writtenByXact(),
  },
  (t) => [primaryKey({ columns: [t.pilotUserId, t.week, t.xid] })],
);
