import type { AllUpTask, PokerTask, WindowTask } from "./definition";
import { bestFill } from "./best-fill";
import { maxResultTenths, sumCapTenths } from "./limits";
import type { LaneScore, ScoredFlight } from "./score";

/** Where the lane stands in time: tenths left to fly and whether a new launch may still count. */
export type Outlook = { timeLeftTenths: number; launchOpen: boolean };

const live = (f: ScoredFlight) => f.excludedReason === null;

/**
 * Best result a window task can still reach: landed flights as they are, the flight in the
 * air growing with the time left, new flights up to the launch limit. Assumes no ground
 * time between flights, so it is an upper bound.
 */
export function bestPossibleWindow(def: WindowTask, lane: LaneScore, outlook: Outlook): number {
  const flights = lane.flights.filter(live);
  const openFlight = flights.find((f) => f.open) ?? null;
  const landed = flights.filter((f) => !f.open);
  const open = openFlight && !openFlight.zeroReason ? openFlight.timeTenths : null;
  const used = flights.length;
  const launchesLeft = !outlook.launchOpen ? 0 : def.launchLimit === null ? Infinity : Math.max(0, def.launchLimit - used);
  const value = (f: ScoredFlight) => (f.zeroReason ? 0 : f.timeTenths);
  const sumCap = (k: number) => sumCapTenths(def, k);
  const caps = def.ladder ? def.ladder.targetsSec.map((t) => t * 10) : null;
  const uniform = (def.capSec ?? def.workingTimeSec) * 10;
  let best = 0;

  if (def.ladder?.order === "in-order" || (def.counting.rule === "all" && !def.ladder)) {
    // Positions are fixed by launch order (K, M, D, L, custom "all").
    const steps = caps ?? (def.launchLimit === null ? null : Array.from({ length: def.launchLimit }, () => uniform));
    if (def.counting.rule === "last" && caps) return bestLastInOrder(caps, landed.map(value), openFlight ? (open ?? 0) : null, launchesLeft, outlook, sumCap);
    let fixed = 0;
    let scored = 0;
    landed.forEach((f, i) => {
      const v = Math.min(value(f), steps?.[i] ?? uniform);
      fixed += v;
      if (v > 0) scored++;
    });
    let room = 0;
    let pos = landed.length;
    if (openFlight) {
      const cap = steps?.[pos] ?? uniform;
      if (open !== null) {
        fixed += Math.min(open, cap);
        room += Math.max(0, cap - open);
        scored++;
      }
      pos++;
    }
    const rest = steps ? steps.slice(pos) : null;
    const newFlights = rest ? Math.min(rest.length, launchesLeft) : launchesLeft;
    for (let m = 0; m <= Math.min(newFlights, 1000); m++) {
      if (m > 0) room += rest ? rest[m - 1]! : uniform;
      const total = fixed + Math.min(outlook.timeLeftTenths, room);
      const cap = sumCap(scored + m);
      best = Math.max(best, cap === null ? total : Math.min(total, cap));
      if (room >= outlook.timeLeftTenths && !rest) break;
    }
  } else if (def.counting.rule === "best") {
    const slots = caps ?? Array.from({ length: def.counting.n }, () => uniform);
    best = bestFill({ caps: slots, fixed: landed.map(value), mustUseFixed: false, open, launchesLeft, timeLeft: outlook.timeLeftTenths, sumCap });
  } else {
    // Last n: what counts is the last n of [landed…, open, new…].
    const n = def.counting.rule === "last" ? def.counting.n : 0;
    const slots = caps ?? Array.from({ length: n }, () => uniform);
    for (let m = 0; m <= Math.min(n, launchesLeft); m++) {
      const keepOpen = openFlight !== null && m < n;
      const keepLanded = Math.max(0, n - m - (keepOpen ? 1 : 0));
      const fixed = keepLanded > 0 ? landed.slice(-keepLanded).map(value) : [];
      const v = bestFill({ caps: slots, fixed, mustUseFixed: true, open: keepOpen ? (open ?? 0) : null, launchesLeft: m, timeLeft: outlook.timeLeftTenths, sumCap });
      best = Math.max(best, v);
    }
  }
  return Math.min(best, maxResultTenths(def));
}

function bestLastInOrder(
  caps: number[], landed: number[], open: number | null, launchesLeft: number, outlook: Outlook, sumCap: (k: number) => number | null,
): number {
  // Custom ladder flown "last n in order": the final n flights must fly the steps in order.
  const n = caps.length;
  let best = 0;
  for (let m = 0; m <= Math.min(n, launchesLeft); m++) {
    const pool = [...landed, ...(open !== null ? [open] : [])];
    const seq = n - m > 0 ? pool.slice(-(n - m)) : [];
    let fixed = 0;
    let room = 0;
    seq.forEach((v, i) => (fixed += Math.min(v, caps[i]!)));
    if (open !== null && m < n && seq.length > 0) room += Math.max(0, caps[seq.length - 1]! - Math.min(open, caps[seq.length - 1]!));
    for (let j = seq.length; j < seq.length + m && j < n; j++) room += caps[j]!;
    const total = fixed + Math.min(outlook.timeLeftTenths, room);
    const cap = sumCap(seq.length + m);
    best = Math.max(best, cap === null ? total : Math.min(total, cap));
  }
  return best;
}

/** Best result still possible in task E (see poker.ts for the readings used). */
export function bestPossiblePoker(def: PokerTask, lane: LaneScore, outlook: Outlook): number {
  const state = lane.poker!;
  const credited = lane.flights.reduce((sum, f) => sum + f.creditedTenths, 0);
  const openFlight = lane.flights.find((f) => f.open && f.excludedReason === null && !f.zeroReason) ?? null;
  const R = outlook.timeLeftTenths;
  let gain = 0;
  let flightsNeeded = 0;
  if (openFlight && openFlight.counted && openFlight.slotCapTenths === null) {
    gain = R; // the end-call flight keeps earning until the end
  } else if (state.done) {
    gain = 0;
  } else if (state.endCallPending) {
    gain = outlook.launchOpen ? R : 0;
    flightsNeeded = 1;
  } else if (state.pendingTargetSec !== null) {
    const target = state.pendingTargetSec * 10;
    const attempting = openFlight !== null && openFlight.targetSec === state.pendingTargetSec;
    const need = attempting ? target - openFlight.timeTenths : outlook.launchOpen ? target : Infinity;
    if (need <= R) {
      const more = def.maxTargets - state.reachedCount - 1 > 0 ? R - need : 0;
      gain = target + more;
      flightsNeeded = more > 0 ? 2 : 1;
    }
  } else if (state.reachedCount < def.maxTargets) {
    const bonus = openFlight && openFlight.reason === "no-target" ? openFlight.timeTenths : 0;
    gain = outlook.launchOpen || bonus > 0 ? R + bonus : 0;
    flightsNeeded = 1;
  }
  const scored = lane.flights.filter((f) => f.creditedTenths > 0).length + flightsNeeded;
  const cap = sumCapTenths(def, scored);
  const total = credited + gain;
  return Math.min(cap === null ? total : Math.min(total, cap), maxResultTenths(def));
}

/** Best result still possible in task C: attempts to come may still reach the cap. */
export function bestPossibleAllUp(def: AllUpTask, lane: LaneScore, signalsMs: readonly number[], nowMs: number): number {
  const cap = def.capSec * 10;
  let total = 0;
  for (let k = 0; k < def.attempts; k++) {
    const f = lane.flights.find((x) => x.attempt === k && x.excludedReason === null);
    const signal = signalsMs[k];
    if (f) {
      if (!f.open || f.zeroReason || signal === undefined) total += f.creditedTenths;
      else total += Math.min(cap, f.timeTenths + Math.max(0, Math.floor((signal + def.landingDeadlineSec * 1000 - nowMs) / 100)));
    } else if (signal === undefined || nowMs - signal <= def.launchWindowMs) total += cap;
  }
  return total;
}
