import type { PokerTask } from "./definition";
import type { LaneCall } from "./flights";
import type { CountDecision } from "./counting";
import type { TimedFlight } from "./timing";

/** Where a poker lane stands after its flights: used by the live state. */
export type PokerState = {
  /** The announced target not yet reached (cannot be changed), or null. */
  pendingTargetSec: number | null;
  reachedCount: number;
  /** "End of working time" was called and its one attempt has not been launched yet. */
  endCallPending: boolean;
  /** No further flight can count (all targets reached, or the end-call attempt flown). */
  done: boolean;
  /** Target or end-of-working-time calls made while a model was in the air, past the grace: refused. */
  refusedCallIds: string[];
};

/**
 * How long after release a target may still be shown for the flight in the air (ours: the
 * rules say "right after release" without a number, F3K.11.5). Later calls are refused.
 */
export const TARGET_SHOWN_WITHIN_MS = 5000;

export type PokerResult = { picks: CountDecision[]; targetOf: (number | null)[]; state: PokerState };

/**
 * Task E (F3K.11.5): each flight attempts the announced target; reaching or exceeding it
 * credits the target; an unreached target stays until reached; at most `maxTargets` count.
 *
 * Readings of points the rules leave open (listed in the README):
 * - A target call is accepted only when no announced target is still unreached ("an
 *   unreached target cannot be changed"); otherwise it is ignored.
 * - A target called within TARGET_SHOWN_WITHIN_MS of a release applies to that flight if
 *   the flight started with no target (the rules allow showing it in writing right after
 *   release). Any call later while the model is in the air is refused (a target is
 *   announced before the launch that attempts it), listed in `refusedCallIds`.
 * - A flight launched with no target attempts nothing and does not count.
 * - AMBIGUOUS "end of working time": the call is accepted under the same condition as a
 *   target; the next launch is the one attempt; it fills one of the target places and is
 *   credited its time up to the end of working time ("flown", the default), or only if
 *   still airborne at the end ("airborne-at-end", a setting); launches after it do not count.
 */
export function countPokerFlights(def: PokerTask, flights: readonly TimedFlight[], calls: readonly LaneCall[]): PokerResult {
  const picks: CountDecision[] = [];
  const targetOf: (number | null)[] = [];
  const endMs = def.workingTimeSec * 1000;
  let pending: number | null = null;
  let reached = 0;
  let endCallPending = false;
  let done = false;
  let c = 0;
  const refusedCallIds: string[] = [];

  const takeCall = (call: LaneCall) => {
    if (done || endCallPending || pending !== null) return;
    if (call.kind === "target") pending = call.targetSec;
    else if (def.endCall !== "not-allowed") endCallPending = true;
  };

  for (const f of flights) {
    while (c < calls.length && calls[c]!.atMs <= f.launchAtMs) takeCall(calls[c++]!);
    const landAt = f.open ? Infinity : (f.landAtMs ?? Infinity);
    // A target shown right after release, for a flight launched with none pending.
    const shownBy = Math.min(landAt, f.launchAtMs + TARGET_SHOWN_WITHIN_MS);
    if (!f.excludedReason && !done && !endCallPending) {
      while (pending === null && c < calls.length && calls[c]!.atMs <= shownBy) {
        const call = calls[c++]!;
        if (call.kind === "target") pending = call.targetSec;
      }
    }
    // Anything else called while the model is in the air is refused: a target is announced
    // before the launch that attempts it (F3K.11.5), not during or after that flight.
    while (c < calls.length && calls[c]!.atMs < landAt) refusedCallIds.push(calls[c++]!.id);
    if (f.excludedReason) {
      picks.push({ counted: false, slotCapTenths: null, creditedTenths: 0, reason: f.excludedReason });
      targetOf.push(null);
      continue;
    }
    if (done) {
      picks.push({ counted: false, slotCapTenths: null, creditedTenths: 0, reason: f.zeroReason ?? "after-final-target" });
      targetOf.push(null);
      continue;
    }
    if (endCallPending) {
      endCallPending = false;
      done = true;
      const airborneAtEnd = f.open || f.landMs === null || f.landMs >= endMs;
      const credit = f.zeroReason || (def.endCall === "airborne-at-end" && !airborneAtEnd) ? 0 : f.timeTenths;
      picks.push({ counted: true, slotCapTenths: null, creditedTenths: credit, reason: f.zeroReason });
      targetOf.push(null);
      continue;
    }
    targetOf.push(pending);
    if (pending === null) {
      picks.push({ counted: false, slotCapTenths: null, creditedTenths: 0, reason: f.zeroReason ?? "no-target" });
      continue;
    }
    const target = pending * 10;
    if (!f.zeroReason && f.timeTenths >= target) {
      picks.push({ counted: true, slotCapTenths: target, creditedTenths: target, reason: null });
      reached += 1;
      pending = null;
      if (reached >= def.maxTargets) done = true;
    } else {
      picks.push({ counted: false, slotCapTenths: target, creditedTenths: 0, reason: f.zeroReason ?? "target-missed" });
    }
  }
  while (c < calls.length) takeCall(calls[c++]!);
  return { picks, targetOf, state: { pendingTargetSec: pending, reachedCount: reached, endCallPending, done, refusedCallIds } };
}
