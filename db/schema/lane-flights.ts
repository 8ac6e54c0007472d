import { doublePrecision, foreignKey, integer, pgTable, primaryKey, smallint, text, uuid } from "drizzle-orm/pg-core";
import { runLanes } from "./sessions";

/**
 * Each derived flight of a lane as a row, with the values the season reads (db/queries/season):
 * duration, credited time, target and the ground time since the lane's previous landing
 * (`ground_ms`: null for the first flight or when the previous one never landed). Never written
 * by the app: triggers on `run_lanes` (migration "lane-flights-trigger" for a new lane, and since
 * "run-lanes-season-columns-by-trigger" the BEFORE trigger that keeps the Season columns) keep it equal to
 * `run_lanes.derived -> 'flights'` whenever any code stores a lane's derivation, touching only
 * the rows that changed, so a push into a long run rewrites only its new or changed flights.
 */
export const laneFlights = pgTable(
  "lane_flights",
  {
    runId: uuid("run_id").notNull(),
    lane: smallint("lane").notNull(),
    /** The flight's place in the lane's derived flights (0-based): the previous landing is at position − 1. */
    position: integer("position").notNull(),
    flightIndex: integer("flight_index").notNull(),
    launchMs: doublePrecision("launch_ms"),
    landMs: doublePrecision("land_ms"),
    status: text("status"),
    timeTenths: integer("time_tenths"),
    creditedTenths: integer("credited_tenths"),
    targetSec: integer("target_sec"),
    groundMs: doublePrecision("ground_ms"),
  },
  (t) => [
    primaryKey({ columns: [t.runId, t.lane, t.position] }),
    foreignKey({ columns: [t.runId, t.lane], foreignColumns: [runLanes.runId, runLanes.lane] }).onDelete("cascade"),
  ],
);
