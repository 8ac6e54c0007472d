import type { TaskDefinition } from "./definition";
import { pairFlights } from "./flights";
import { scoreLane, type LaneScore } from "./score";
import type { TimelineEvent } from "./timeline";

export type FoldedRun = {
  definition: TaskDefinition;
  /** Working-time start (task C: the first launch signal) on the timeline, if given. */
  windowStartMs: number | null;
  /** Task C: every launch signal in order. */
  signalsMs: number[];
  runEndMs: number | null;
  lanes: LaneScore[];
};

/**
 * Folds a finished run's events into flights and results per lane: applies undo and
 * corrections, pairs launches with landings, applies the timing and counting rules.
 * A flight still open here never landed and scores zero. Pure: same input, same output.
 */
export function foldRun(definition: TaskDefinition, events: readonly TimelineEvent[], options: { laneCount?: number } = {}): FoldedRun {
  return foldAt(definition, events, null, options.laneCount);
}

/** foldRun with a clock: open flights are timed to `nowMs` (used by the live state). */
export function foldAt(
  definition: TaskDefinition,
  events: readonly TimelineEvent[],
  nowMs: number | null,
  laneCount?: number,
): FoldedRun {
  const run = pairFlights(events, laneCount);
  const clock = nowMs === null ? null : { nowMs };
  return {
    definition,
    windowStartMs: run.signalsMs[0] ?? null,
    signalsMs: run.signalsMs,
    runEndMs: run.runEndMs,
    lanes: run.lanes.map((log) => scoreLane(definition, run, log, clock)),
  };
}
