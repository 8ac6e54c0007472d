import "server-only";
import { sql, type SQL } from "drizzle-orm";

/**
 * THE turnaround: a flight's `lane_flights.ground_ms` (the ground time from the lane's previous
 * landing to this launch, stored at derive time from lib/results' flights) counts as turnaround when
 * it is known, is really time on the ground — a record can hold a launch before the landing — and
 * the run's task lets the pilot choose when to relaunch. In a task whose every flight is launched at
 * a start signal (`runs.flights_on_signal`, lib/tasks flightsStartOnSignal: task C, all up, F3K.11
 * "Task C details" in RULES.md) the time from one attempt's landing to the next launch is the wait
 * for the next signal, not a turnaround a pilot practises to cut (common practice).
 * The Season's charts and flights table (scope.ts), the coach's roster (coach/roster.ts), practice-plan
 * goals (coach/plans.ts → lib/coach/plan-goals.ts), the model page (model-record.ts) and the Day board's
 * turnaround leaders (club-day-board.ts) all read it through this condition. The Season's summary without a
 * model filter reads its ground-time part as stored per lane (run_lanes.season_turnaround_ms, migration
 * "season-lane-bins": known and not negative) and applies the task's part per lane (scope.ts); the integration
 * tests season-lane-arrays and sync-derive-batches compare that array with this condition over lane_flights.
 */
export function isTurnaround(groundMs: SQL, flightsOnSignal: SQL): SQL {
  return sql`(${groundMs} is not null and ${groundMs} >= 0 and not ${flightsOnSignal})`;
}

/**
 * Whether every flight of the run `run` (an alias of `runs`) is launched at a start signal: its stored
 * task is an all-up task (lib/tasks flightsStartOnSignal — in the catalogue, task C), as the generated
 * column runs.flights_on_signal keeps it (db/schema/sessions.ts).
 */
export function flightsOnSignal(run: SQL): SQL {
  return sql`${run}.flights_on_signal`;
}
