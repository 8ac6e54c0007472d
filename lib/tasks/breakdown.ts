import type { TaskDefinition } from "./definition";
import { isWindowBound, maxResultTenths, slotCapsTenths } from "./limits";
import type { LaneScore } from "./score";

/** Where a finished run's points went, in tenths of a second; the parts sum to `lostTenths`. */
export type PointsLost = {
  maxTenths: number;
  scoredTenths: number;
  lostTenths: number;
  parts: {
    /** Flights that scored zero by rule (invalid, launched early, landed late, never landed). */
    invalid: number;
    /** Airtime of valid flights the counting rule left out (not among the best, superseded, missed target). */
    notCounted: number;
    /** Airtime flown beyond a counted flight's cap or target. */
    overCap: number;
    /** Counted flights short of their cap or target, and places never flown. */
    shortOfTarget: number;
    /** Working time spent on the ground beyond what the task allows. */
    groundTime: number;
    /** The flown result a round-zero ruling took away (F3K.4.1 contact at launch, F3K.1.2 not signed). */
    roundZero: number;
  };
  /** Penalty points (contest points, not seconds — reported beside the seconds, not inside them). */
  penaltyPoints: number;
  /** The working time, not the flight maxima, limits this task (see limits.ts). */
  windowBound: boolean;
};

/**
 * Splits max − result into causes that add up exactly (integer tenths).
 *
 * Tasks limited by their slot maxima (A, B, C, F, J, L, N) lose only slot by slot: each
 * counted flight loses cap − credit (to `invalid` if it scored zero by rule, else to
 * `shortOfTarget`), each place never flown loses its cap.
 *
 * Tasks limited by the working time (D, E, G, H, I, K, M) lose every tenth of the window
 * that did not score: the window splits exactly into scored time, airtime beyond caps,
 * airtime that did not count, airtime of zero-scoring flights and time on the ground. The
 * loss is taken from those causes in that order (invalid, not counted, over cap, waiting
 * after the last permitted launch → short of target), the rest going to ground time — which
 * is thereby net of the one second per flight that F3K.7 allows.
 */
export function pointsLost(def: TaskDefinition, lane: LaneScore): PointsLost {
  const maxTenths = maxResultTenths(def);
  const scoredTenths = lane.resultTenths;
  const lostTenths = maxTenths - scoredTenths;
  const parts = { invalid: 0, notCounted: 0, overCap: 0, shortOfTarget: 0, groundTime: 0, roundZero: lane.zeroedTenths };
  const windowBound = isWindowBound(def);

  if (!windowBound) {
    const unused = [...(slotCapsTenths(def) ?? [])];
    for (const f of lane.flights) {
      if (!f.counted || f.slotCapTenths === null) continue;
      const at = unused.indexOf(f.slotCapTenths);
      if (at >= 0) unused.splice(at, 1);
      if (f.zeroReason) parts.invalid += f.slotCapTenths;
      else parts.shortOfTarget += f.slotCapTenths - f.creditedTenths;
    }
    parts.shortOfTarget += unused.reduce((a, b) => a + b, 0);
  } else if (def.kind !== "all-up") {
    const raw = { invalid: 0, notCounted: 0, overCap: 0, shortOfTarget: 0 };
    for (const f of lane.flights) {
      if (f.zeroReason && !f.excludedReason) raw.invalid += f.inWindowTenths;
      else if (f.counted) raw.overCap += f.inWindowTenths - f.creditedTenths;
      else raw.notCounted += f.inWindowTenths;
    }
    raw.shortOfTarget = idleAfterLastLaunch(def, lane);
    let remaining = lostTenths - lane.zeroedTenths;
    for (const key of ["invalid", "notCounted", "overCap", "shortOfTarget"] as const) {
      const take = Math.max(0, Math.min(remaining, raw[key]));
      parts[key] = take;
      remaining -= take;
    }
    parts.groundTime = remaining;
  }
  return { maxTenths, scoredTenths, lostTenths, parts, penaltyPoints: lane.penaltyPoints, windowBound };
}

/** Working time left after the last permitted flight landed, when no further launch could count. */
function idleAfterLastLaunch(def: TaskDefinition, lane: LaneScore): number {
  if (def.kind === "all-up") return 0;
  const eligible = lane.flights.filter((f) => f.excludedReason === null);
  const exhausted = def.kind === "window" ? def.launchLimit !== null && eligible.length >= def.launchLimit : lane.poker?.done === true;
  const last = eligible[eligible.length - 1];
  if (!exhausted || !last || last.landMs === null) return 0;
  const window = def.workingTimeSec * 1000;
  return last.landMs >= window ? 0 : Math.floor((window - Math.max(0, last.landMs)) / 100);
}
