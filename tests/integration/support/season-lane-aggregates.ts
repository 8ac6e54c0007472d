import { sql, type SQL } from "drizzle-orm";
import { DURATION_BIN_SEC, LAST_DURATION_BIN } from "@/db/queries/season/scope";

/**
 * The per-lane aggregates run_lanes keeps for the Season's summary (season_turnaround_ms,
 * season_duration_bins; migration "season-lane-bins") beside the same values computed in SQL from the
 * lane's lane_flights rows (`lane` is an alias of run_lanes): the ground times isTurnaround counts
 * (known, not negative; db/queries/season/turnaround.ts) in flight order, and the landed flights per
 * duration bin with the summary's own bin width and last bin (db/queries/season/scope.ts), so the
 * migration's constants and the code's cannot drift apart unnoticed.
 */
export function laneAggregatesBeside(lane: SQL) {
  const flights = sql`lane_flights f where f.run_id = ${lane}.run_id and f.lane = ${lane}.lane`;
  return {
    stored: sql`json_build_object('turnaround', ${lane}.season_turnaround_ms, 'bins', ${lane}.season_duration_bins)`,
    fromFlights: sql`json_build_object(
      'turnaround', (select array_agg(f.ground_ms order by f.position) filter (where ${isTurnaroundGround}) from ${flights}),
      'bins', (select array_agg((select count(*)::int from ${flights} and f.land_ms is not null and f.time_tenths is not null
          and least(f.time_tenths / ${DURATION_BIN_SEC * 10}, ${LAST_DURATION_BIN}) = b) order by b)
        from generate_series(0, ${LAST_DURATION_BIN}) b))`,
  };
}

/** isTurnaround's condition on the ground time alone (the task's part is the query's, per lane). */
const isTurnaroundGround = sql`f.ground_ms is not null and f.ground_ms >= 0`;
