import "server-only";
import { sql } from "drizzle-orm";
import type { BoardLaneInput } from "@/lib/days/board";
import type { LaneDerivation } from "@/lib/results";
import type { Database } from "../index";
import { deriveWithStanding } from "./runs";
import { isTurnaround } from "./season/turnaround";

/** A stored decision as the board reads it: whose record stands for a lane (null: a note only). */
export type StandingDecision = { run_id: string; lane: number; device_id: string | null };

const key = (runId: string, lane: number) => `${runId}:${lane}`;

/**
 * The day's lanes with the officer's decisions applied (club_day_decisions): a lane whose decision names
 * a phone is derived again by lib/results runResult with that phone's record standing
 * (deriveWithStanding: the run's stored events, the conflict rules replaced for that lane only), and
 * the board's result, flights, versions, review flag and turnarounds for it come from that derivation.
 * A note-only decision, or one naming a phone that did not record the lane, changes nothing. The
 * turnarounds are lane_flights' own (the trigger's function lane_flights_rows_at over the derived
 * flights, through isTurnaround). The stored result (run_lanes) is not touched: the decision is the
 * club's for its day (see DEVELOPERS.md "Field days and the Day board").
 */
export async function withDecisions(db: Database, lanes: readonly BoardLaneInput[], decisions: readonly StandingDecision[]): Promise<BoardLaneInput[]> {
  const usedNow = new Map(lanes.map((l) => [key(l.runId, l.lane), (l.derived as { source?: { deviceId?: unknown } | null } | null)?.source?.deviceId]));
  const standing = new Map<string, Map<number, string>>();
  const already = new Set<string>(); // the decision names the record the stored result already uses: nothing to derive
  for (const d of decisions) {
    const k = key(d.run_id, d.lane);
    if (d.device_id === null || !usedNow.has(k)) continue;
    if (usedNow.get(k) === d.device_id) already.add(k);
    else standing.set(d.run_id, (standing.get(d.run_id) ?? new Map<number, string>()).set(d.lane, d.device_id));
  }
  const mark = (l: BoardLaneInput): BoardLaneInput => (already.has(key(l.runId, l.lane)) ? { ...l, decided: true } : l);
  if (standing.size === 0) return lanes.map(mark);
  const derived = await db.transaction((tx) => deriveWithStanding(tx, standing));
  const decided: { runId: string; lane: number; derivation: LaneDerivation }[] = [];
  for (const [runId, byLane] of standing) {
    for (const [lane, deviceId] of byLane) {
      const d = derived.get(runId)?.find((x) => x.lane === lane);
      if (d && d.derived.source?.deviceId === deviceId) decided.push({ runId, lane, derivation: d });
    }
  }
  if (decided.length === 0) return lanes.map(mark);
  const rows = decided.map((d, i) => ({ i, run_id: d.runId, flights: d.derivation.derived.flights }));
  const grounds = await db.execute<{ i: number; ground: (number | null)[] | null }>(sql`
    select x.i, (select array_agg(case when ${isTurnaround(sql`g.ground_ms`, sql`r.flights_on_signal`)} then g.ground_ms end order by g.position)
      from lane_flights_rows_at(x.flights, array(select generate_series(0, jsonb_array_length(x.flights) - 1))) g) as ground
    from jsonb_to_recordset(${JSON.stringify(rows)}::jsonb) as x(i int, run_id uuid, flights jsonb)
    join runs r on r.id = x.run_id`);
  const groundOf = new Map(grounds.rows.map((g) => [g.i, g.ground ?? []]));
  const byKey = new Map(decided.map((d, i) => [key(d.runId, d.lane), { ...d.derivation, groundMs: groundOf.get(i) ?? [] }]));
  return lanes.map((l) => {
    const d = byKey.get(key(l.runId, l.lane));
    return d ? { ...l, resultTenths: d.resultTenths, needsReview: d.needsReview, derived: d.derived, groundMs: d.groundMs, decided: true } : mark(l);
  });
}
