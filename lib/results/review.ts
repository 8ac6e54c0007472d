import { judgeBoundary } from "@/lib/clock";
import type { LaneScore, TaskDefinition } from "@/lib/tasks";
import type { ReviewItem } from "./types";

/** A signal (window start, task C launch signal) on the server timeline with its bound. */
export type TimedSignal = { atMs: number; uncertaintyMs: number };

/** Uncertainty lookups for the lane source's effective launches (by id) and landings (by time). */
export type LaneUncertainty = { launch(id: string): number; landing(atMs: number): number };

/**
 * Launches and landings that the clocks cannot place on one side of a boundary set by a
 * signal given on another device (SYNC.md §4): launch vs the working-time signal and vs the
 * end of working time, landing vs the end of the landing window (task C: launch vs the
 * signal and vs the launch window, landing vs the landing deadline). Each is judged with
 * lib/clock judgeBoundary; "uncertain" means officials must decide, not the code.
 */
export function uncertainBoundaries(
  def: TaskDefinition,
  lane: LaneScore,
  signals: readonly TimedSignal[],
  unc: LaneUncertainty,
): ReviewItem[] {
  const out: ReviewItem[] = [];
  const check = (eventId: string, atMs: number, eventUnc: number, boundary: string, boundaryMs: number, boundaryUnc: number) => {
    if (judgeBoundary(atMs, eventUnc, boundaryMs, boundaryUnc) !== "uncertain") return;
    const margin = eventUnc + boundaryUnc;
    out.push({ eventId, boundary, atMs, boundaryMs, marginMs: Number.isFinite(margin) ? margin : null });
  };
  for (const f of lane.flights) {
    const launchUnc = unc.launch(f.launchId);
    const landUnc = f.landAtMs === null ? 0 : unc.landing(f.landAtMs);
    if (def.kind === "all-up") {
      const s = f.attempt === null ? undefined : signals[f.attempt];
      if (!s) continue;
      check(f.launchId, f.launchAtMs, launchUnc, "launch signal", s.atMs, s.uncertaintyMs);
      check(f.launchId, f.launchAtMs, launchUnc, "end of the launch window", s.atMs + def.launchWindowMs, s.uncertaintyMs);
      if (f.landAtMs !== null) {
        check(f.launchId, f.landAtMs, landUnc, "landing deadline", s.atMs + def.landingDeadlineSec * 1000, s.uncertaintyMs);
      }
      continue;
    }
    const s = signals[0];
    if (!s) continue;
    const endMs = s.atMs + def.workingTimeSec * 1000;
    check(f.launchId, f.launchAtMs, launchUnc, "working-time signal", s.atMs, s.uncertaintyMs);
    check(f.launchId, f.launchAtMs, launchUnc, "end of working time", endMs, s.uncertaintyMs);
    if (f.landAtMs !== null) {
      check(f.launchId, f.landAtMs, landUnc, "end of the landing window", endMs + def.landingWindowSec * 1000, s.uncertaintyMs);
    }
  }
  return out;
}

/** One line for officials: which flight, which boundary, by how much the clocks are unsure. */
export function describeReview(items: readonly ReviewItem[], flightIndexOf: (eventId: string) => number | null): string | null {
  if (items.length === 0) return null;
  const parts = items.slice(0, 3).map((r) => {
    const n = flightIndexOf(r.eventId);
    const who = n === null ? "A flight" : `Flight ${n + 1}`;
    const diff = ((r.atMs - r.boundaryMs) / 1000).toFixed(2);
    const bound = r.marginMs === null ? "a clock never measured" : `clocks ±${(r.marginMs / 1000).toFixed(2)} s`;
    return `${who}: ${diff} s from the ${r.boundary} timed on another device (${bound})`;
  });
  const more = items.length > 3 ? ` (+${items.length - 3} more)` : "";
  return `${parts.join("; ")}${more}`;
}
