import "server-only";
import { sql, type SQL } from "drizzle-orm";

/**
 * THE turnaround: a flight's `lane_flights.ground_ms` (the ground time from the lane's previous
 * landing to this launch, stored at derive time from lib/results' flights) counts as turnaround when
 * it is known and is really time on the ground — a record can hold a launch before the landing.
 * The Season's charts (summary.ts), the coach's roster (coach/roster.ts) and practice-plan goals
 * (coach/plans.ts → lib/coach/plan-goals.ts) all read it through this condition.
 */
export function isTurnaround(groundMs: SQL): SQL {
  return sql`(${groundMs} is not null and ${groundMs} >= 0)`;
}
