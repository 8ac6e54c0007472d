import type { TaskDefinition } from "./definition";
import type { RunClock } from "./run-clock";
import type { LaneScore } from "./score";
import { formatTenths } from "./time";

export type WarningCode =
  | "launch-scores-zero"
  | "launch-will-not-count"
  | "next-launch-replaces"
  | "flight-scores-zero"
  | "flight-not-counted"
  | "flight-at-maximum"
  | "target-reached"
  | "target-unreachable"
  | "land-within-window"
  | "landing-scores-zero";

/** A warning for the timekeeper: a stable code for the UI and an English sentence. */
export type LiveWarning = { code: WarningCode; message: string };

const sec = (ms: number) => Math.ceil(ms / 1000);

/** The warnings for one lane at the run's clock. */
export function laneWarnings(def: TaskDefinition, lane: LaneScore, clock: RunClock, signalsMs: readonly number[], nowMs: number): LiveWarning[] {
  const out: LiveWarning[] = [];
  const open = lane.flights.find((f) => f.open) ?? null;
  const eligible = lane.flights.filter((f) => f.excludedReason === null);

  if (!open) {
    if (def.kind === "all-up") {
      const attempt = clock.attempt?.index ?? -1;
      const flown = eligible.some((f) => f.attempt === attempt);
      if (clock.phase === "not-started" || (!clock.launchOpen && !flown))
        out.push({ code: "launch-scores-zero", message: "No launch window is open: a launch now scores zero." });
      else if (flown) out.push({ code: "launch-will-not-count", message: "This attempt is flown: another launch does not count." });
    } else if (clock.phase === "not-started") {
      out.push({ code: "launch-scores-zero", message: "Working time has not started: a launch now scores zero." });
    } else if (!clock.launchOpen) {
      out.push({ code: "launch-will-not-count", message: "Working time is over: a launch now does not count." });
    } else if (def.kind === "window" && def.launchLimit !== null && eligible.length >= def.launchLimit) {
      out.push({ code: "launch-will-not-count", message: `All ${def.launchLimit} launches are used: another launch does not count.` });
    } else if (def.kind === "poker" && lane.poker?.done) {
      out.push({ code: "launch-will-not-count", message: "No target place is left: another launch does not count." });
    } else if (def.kind === "poker" && lane.poker && lane.poker.pendingTargetSec === null && !lane.poker.endCallPending) {
      out.push({ code: "launch-will-not-count", message: "No target is called: call a target before the launch." });
    } else if (def.kind === "window" && def.counting.rule === "last") {
      const counted = eligible.filter((f) => f.counted);
      const oldest = counted[0];
      if (oldest && counted.length >= def.counting.n) {
        const what = def.counting.n === 1 ? "cancels the current result" : "drops the oldest counted flight";
        out.push({ code: "next-launch-replaces", message: `A new launch ${what} (${formatTenths(oldest.creditedTenths)}).` });
      }
    }
  }

  if (open) {
    if (open.excludedReason) out.push({ code: "flight-not-counted", message: "This flight does not count." });
    else if (open.zeroReason && open.zeroReason !== "landed-after-landing-window")
      out.push({ code: "flight-scores-zero", message: `This flight scores zero (${open.zeroReason.replaceAll("-", " ")}).` });
    else if (open.zeroReason === "landed-after-landing-window")
      out.push({ code: "landing-scores-zero", message: "The landing window has closed: a landing now scores zero." });
    else {
      if (def.kind === "poker" && open.counted && open.slotCapTenths !== null)
        out.push({ code: "target-reached", message: `Target ${open.slotCapTenths / 10} s reached: it counts when the model lands.` });
      else if (open.counted && open.slotCapTenths !== null && open.timeTenths >= open.slotCapTenths)
        out.push({ code: "flight-at-maximum", message: `The flight has reached its maximum (${formatTenths(open.slotCapTenths)}): more time does not count.` });
      const deadline = landingDeadline(def, signalsMs, open.attempt);
      if (clock.phase === "landing-window" || (def.kind === "all-up" && deadline !== null && nowMs > deadline - 30_000)) {
        if (deadline !== null) out.push({ code: "land-within-window", message: `Land within ${sec(deadline - nowMs)} s or the flight scores zero.` });
      }
    }
  }

  if (def.kind === "poker" && lane.poker?.pendingTargetSec != null) {
    const target = lane.poker.pendingTargetSec * 10;
    const have = open && !open.zeroReason && open.targetSec === lane.poker.pendingTargetSec ? open.timeTenths : 0;
    const left = Math.floor(clock.flyLeftMs / 100);
    if (target - have > left && (open || clock.launchOpen || clock.phase !== "not-started"))
      out.push({ code: "target-unreachable", message: `The target ${target / 10} s can no longer be reached in the working time left.` });
  }
  return out;
}

function landingDeadline(def: TaskDefinition, signalsMs: readonly number[], attempt: number | null): number | null {
  if (def.kind === "all-up") {
    const signal = attempt === null ? undefined : signalsMs[attempt];
    return signal === undefined ? null : signal + def.landingDeadlineSec * 1000;
  }
  const start = signalsMs[0];
  return start === undefined ? null : start + (def.workingTimeSec + def.landingWindowSec) * 1000;
}
