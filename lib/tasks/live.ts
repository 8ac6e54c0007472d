import type { TaskDefinition } from "./definition";
import { foldAt } from "./fold";
import { maxResultTenths } from "./limits";
import { bestPossibleAllUp, bestPossiblePoker, bestPossibleWindow, type Outlook } from "./best-possible";
import { lengthHints, type LengthHint } from "./hints";
import { nextTargets } from "./next-target";
import type { LaneScore, ScoredFlight } from "./score";
import type { TimelineEvent } from "./timeline";
import { phaseOf, type Phase } from "./run-clock";
import { laneWarnings, type LiveWarning } from "./warnings";

/** A flight as the timer draws it on the working-time strip (ms from working-time start). */
export type LiveFlight = Pick<
  ScoredFlight,
  "index" | "launchId" | "launchMs" | "landMs" | "attempt" | "open" | "status" | "reason" | "targetSec" | "creditedTenths" | "timeTenths" | "slotCapTenths" | "airTenths"
>;

export type LaneLive = {
  lane: number;
  flights: LiveFlight[];
  /** Time of the flight in the air (ms), or null. */
  currentFlightMs: number | null;
  /** Result of the landed flights (tenths). */
  resultTenths: number;
  /** Result if the model in the air landed now (tenths). */
  ifLandedNowTenths: number;
  /** Upper bound on the final result, assuming an instant relaunch (tenths). */
  bestPossibleTenths: number;
  /** The target to fly next (H, K, M, E, custom ladders), or null. */
  nextTargetSec: number | null;
  /** Targets not yet flown (ladders: in order for in-order ladders). */
  remainingTargetsSec: number[];
  /** Any-order ladders (H): what a flight of each target length launched now still adds. */
  hints: LengthHint[];
  /** Launches that may still count, or null when unlimited. */
  launchesLeft: number | null;
  penaltyPoints: number;
  warnings: LiveWarning[];
};

export type LiveState = {
  phase: Phase;
  nowMs: number;
  /** ms since working-time start (task C: since the current attempt's signal), or null. */
  elapsedMs: number | null;
  /** Working time left (task C: until the current attempt's landing deadline), or null before the start. */
  workingTimeLeftMs: number | null;
  /** Landing window left once working time is over, else null. */
  landingWindowLeftMs: number | null;
  /** Task C: the current attempt (0-based) and how many there are. */
  attempt: { index: number; of: number } | null;
  maxTenths: number;
  lanes: LaneLive[];
};

/**
 * The live state of a run at `nowMs` (all times on the one timeline of the events):
 * per lane the flights, what counts, the result now, the best still possible, the next
 * target and the warnings a timekeeper needs. Pure function of its inputs.
 */
export function liveState(definition: TaskDefinition, events: readonly TimelineEvent[], nowMs: number, options: { laneCount?: number } = {}): LiveState {
  const run = foldAt(definition, events, nowMs, options.laneCount);
  const landedOnly = foldAt(definition, events.filter((e) => !isOpenLaunch(e, run.lanes)), nowMs, run.lanes.length);
  const clock = phaseOf(definition, run.signalsMs, nowMs);
  const lanes = run.lanes.map((lane, i): LaneLive => {
    // Rounded up: the flight in the air is timed in whole tenths too, and the bound must not
    // lose the tenth that truncating the two parts separately would drop.
    const outlook: Outlook = { timeLeftTenths: Math.ceil(clock.flyLeftMs / 100), launchOpen: clock.launchOpen };
    const best =
      definition.kind === "window"
        ? bestPossibleWindow(definition, lane, outlook)
        : definition.kind === "poker"
          ? bestPossiblePoker(definition, lane, outlook)
          : bestPossibleAllUp(definition, lane, run.signalsMs, nowMs);
    const open = lane.flights.find((f) => f.open) ?? null;
    const targets = nextTargets(definition, lane, outlook);
    const landedTenths = landedOnly.lanes[i]?.resultTenths ?? 0;
    return {
      lane: lane.lane,
      flights: lane.flights.map(toLive),
      currentFlightMs: open ? nowMs - open.launchAtMs : null,
      resultTenths: landedTenths,
      ifLandedNowTenths: lane.resultTenths,
      bestPossibleTenths: Math.max(best, lane.resultTenths),
      nextTargetSec: targets.next,
      remainingTargetsSec: targets.remaining,
      hints: open ? [] : lengthHints(definition, events, clock, nowMs, lane.lane, run.lanes.length, landedTenths),
      launchesLeft: launchesLeft(definition, lane),
      penaltyPoints: lane.penaltyPoints,
      warnings: laneWarnings(definition, lane, clock, run.signalsMs, nowMs),
    };
  });
  return {
    phase: clock.phase,
    nowMs,
    elapsedMs: clock.elapsedMs,
    workingTimeLeftMs: clock.workingTimeLeftMs,
    landingWindowLeftMs: clock.landingWindowLeftMs,
    attempt: clock.attempt,
    maxTenths: maxResultTenths(definition),
    lanes,
  };
}

function launchesLeft(def: TaskDefinition, lane: LaneScore): number | null {
  const used = lane.flights.filter((f) => f.excludedReason === null).length;
  if (def.kind === "all-up") return Math.max(0, def.attempts - used);
  if (def.kind === "poker" || def.launchLimit === null) return null;
  return Math.max(0, def.launchLimit - used);
}

function isOpenLaunch(e: TimelineEvent, lanes: readonly LaneScore[]): boolean {
  if (e.body.kind !== "launch") return false;
  const lane = lanes[e.body.lane];
  return lane?.flights.some((f) => f.open && f.launchId === e.id) ?? false;
}

function toLive(f: ScoredFlight): LiveFlight {
  const { index, launchId, launchMs, landMs, attempt, open, status, reason, targetSec, creditedTenths, timeTenths, slotCapTenths, airTenths } = f;
  return { index, launchId, launchMs, landMs, attempt, open, status, reason, targetSec, creditedTenths, timeTenths, slotCapTenths, airTenths };
}
