import type { RunEvent } from "@/lib/events/schema";
import { pairFlights } from "@/lib/tasks/flights";
import type { TimelineEvent } from "@/lib/tasks";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";

/** What a tap on a lane's big control records. */
export type TapKind = "launch" | "landing";

/**
 * A tap toggles: landing when the lane has a model in the air, else launch. Decided from the
 * stored events only (never from what the screen last drew), and with no debounce: a landing
 * and a relaunch 0.3 s apart are two taps (RULES.md, common practice).
 *
 * This is the only work on a tap's path before its write, so it only pairs the lanes'
 * launches and landings (undo and corrections applied) — the same pairing the live state's
 * "flight in the air" comes from — and computes no results, hints or warnings: the screen
 * computes those after the event is stored.
 */
export function tapKindFor(timeline: readonly TimelineEvent[], lane: number, laneCount: number): TapKind {
  const log = pairFlights(timeline, laneCount).lanes[lane];
  return log?.flights.some((f) => f.landAtMs === null) ? "landing" : "launch";
}

const LANE_KINDS = new Set(["launch", "landing", "target", "end-call"]);

/**
 * The event "undo" voids for a lane: the lane's latest effective tap (launch, landing,
 * target or end call); with no lane taps at all in the run, the working-time start.
 * Null when there is nothing to undo.
 */
export function undoTargetFor(timeline: readonly TimelineEvent[], lane: number): TimelineEvent | null {
  const effective = applyUndoAndCorrections(timeline);
  let laneTap: TimelineEvent | null = null;
  let anyLaneTap = false;
  let start: TimelineEvent | null = null;
  for (const e of effective) {
    if (LANE_KINDS.has(e.body.kind)) anyLaneTap = true;
    if ("lane" in e.body && e.body.lane === lane && LANE_KINDS.has(e.body.kind)) laneTap = e;
    if (e.body.kind === "window-start") start = e;
  }
  if (laneTap) return laneTap;
  return anyLaneTap ? null : start;
}

/** Whether a run is still open: no effective run-end event. */
export function isRunOpen(events: readonly RunEvent[]): boolean {
  const timeline = events.map((e) => ({ id: e.id, atMs: e.stamp.wallMs, body: e.body }));
  return !applyUndoAndCorrections(timeline).some((e) => e.body.kind === "run-end");
}
