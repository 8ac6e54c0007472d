import { date, doublePrecision, integer, pgTable, primaryKey, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";

/**
 * Each pilot's turnarounds per week (Monday, UTC, of the run's day): how many, their median and 90th percentile
 * in ms (percentile_cont, as the summary computes them with a filter), which the Season's summary without filters
 * reads (db/queries/season/summary.ts) instead of sorting every turnaround of the season. Kept by PostgreSQL triggers on
 * run_lanes, runs and lane_consents (migration "season-week-turnarounds-triggers"), whatever code writes them:
 * a week's row is worked out again from its lanes whenever one of them, its run or its consent changes.
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
