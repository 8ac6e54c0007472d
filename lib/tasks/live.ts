import type { TaskDefinition } from "./definition";
import { foldAt } from "./fold";
import { maxResultTenths } from "./limits";
import { bestPossibleAllUp, bestPossiblePoker, bestPossibleWindow, type Outlook } from "./best-possible";
import { nextTargets } from "./next-target";
import type { LaneScore, ScoredFlight } from "./score";
import type { TimelineEvent } from "./timeline";
import { laneWarnings, type LiveWarning } from "./warnings";

export type Phase = "not-started" | "working" | "landing-window" | "ended";

/** A flight as the timer draws it on the working-time strip (ms from working-time start). */
export type LiveFlight = Pick<
  ScoredFlight,
  "index" | "launchId" | "launchMs" | "landMs" | "attempt" | "open" | "status" | "reason" | "targetSec" | "creditedTenths" | "timeTenths"
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
    return {
      lane: lane.lane,
      flights: lane.flights.map(toLive),
      currentFlightMs: open ? nowMs - open.launchAtMs : null,
      resultTenths: landedOnly.lanes[i]?.resultTenths ?? 0,
      ifLandedNowTenths: lane.resultTenths,
      bestPossibleTenths: Math.max(best, lane.resultTenths),
      nextTargetSec: targets.next,
      remainingTargetsSec: targets.remaining,
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

/** The run's clock at `nowMs`: phase, time left, and whether a launch now may count. */
export type RunClock = {
  phase: Phase;
  elapsedMs: number | null;
  workingTimeLeftMs: number | null;
  landingWindowLeftMs: number | null;
  attempt: { index: number; of: number } | null;
  /** Time still counted for a flight in the air or launched now. */
  flyLeftMs: number;
  launchOpen: boolean;
};

/** Works out the phase of the run at `nowMs`. */
export function phaseOf(def: TaskDefinition, signalsMs: readonly number[], nowMs: number): RunClock {
  if (def.kind === "all-up") {
    const given = signalsMs.slice(0, def.attempts);
    const index = given.length - 1;
    const signal = given[index];
    if (signal === undefined || nowMs < signal) {
      return { phase: "not-started", elapsedMs: null, workingTimeLeftMs: null, landingWindowLeftMs: null, attempt: null, flyLeftMs: def.capSec * 1000, launchOpen: false };
    }
    const deadline = signal + def.landingDeadlineSec * 1000;
    const attempt = { index, of: def.attempts };
    const phase: Phase = nowMs <= deadline ? "working" : "ended";
    const launchOpen = nowMs - signal <= def.launchWindowMs;
    return { phase, elapsedMs: nowMs - signal, workingTimeLeftMs: Math.max(0, deadline - nowMs), landingWindowLeftMs: null, attempt, flyLeftMs: Math.max(0, deadline - nowMs), launchOpen };
  }
  const start = signalsMs[0];
  const wtMs = def.workingTimeSec * 1000;
  if (start === undefined || nowMs < start) {
    return { phase: "not-started", elapsedMs: null, workingTimeLeftMs: null, landingWindowLeftMs: null, attempt: null, flyLeftMs: wtMs, launchOpen: false };
  }
  const end = start + wtMs;
  const landingEnd = end + def.landingWindowSec * 1000;
  const phase: Phase = nowMs < end ? "working" : nowMs <= landingEnd ? "landing-window" : "ended";
  return {
    phase,
    elapsedMs: nowMs - start,
    workingTimeLeftMs: Math.max(0, end - nowMs),
    landingWindowLeftMs: phase === "landing-window" ? landingEnd - nowMs : null,
    attempt: null,
    flyLeftMs: Math.max(0, end - nowMs),
    launchOpen: nowMs < end,
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
  const { index, launchId, launchMs, landMs, attempt, open, status, reason, targetSec, creditedTenths, timeTenths } = f;
  return { index, launchId, launchMs, landMs, attempt, open, status, reason, targetSec, creditedTenths, timeTenths };
}
