import { sql, type SQL } from "drizzle-orm";
import { DURATION_BIN_SEC, LAST_DURATION_BIN } from "@/db/queries/season/scope";
import { isTurnaround } from "@/db/queries/season/turnaround";

/**
 * The per-lane aggregates run_lanes keeps for the Season's summary (season_turnaround_ms,
 * season_duration_bins; migration "season-lane-bins") beside the same values computed in SQL from the
 * lane's lane_flights rows (`lane` is an alias of run_lanes): the ground times isTurnaround counts
 * (db/queries/season/turnaround.ts, on a task not launched on signals) in flight order, and the landed flights per
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

/** THE turnaround condition on a task not launched on signals (the task's part is the summary's, per lane). */
const isTurnaroundGround = isTurnaround(sql`f.ground_ms`, sql`false`);
