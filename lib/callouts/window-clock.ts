import type { LiveState, TaskDefinition } from "@/lib/tasks";
import { callout, countdown, LAST_TEN, minutesText } from "./countdown";
import type { Callout } from "./types";

/** Working-time start, end and landing-window end on the run's timeline (window and poker tasks). */
export type WindowTimes = { startMs: number; endMs: number; landingEndMs: number };

/** The window's times, worked back from the live state (null before the start or for task C). */
export function windowTimes(def: TaskDefinition, live: LiveState): WindowTimes | null {
  if (def.kind === "all-up" || live.elapsedMs === null) return null;
  const startMs = live.nowMs - live.elapsedMs;
  const endMs = startMs + def.workingTimeSec * 1000;
  return { startMs, endMs, landingEndMs: endMs + def.landingWindowSec * 1000 };
}

/**
 * Working-time callouts: every whole minute left (the full count at the start, e.g.
 * "10 minutes"), the last 10 s counted down, and the end.
 */
export function workingTimeCallouts(def: TaskDefinition, times: WindowTimes): Callout[] {
  if (def.kind === "all-up") return [];
  const out: Callout[] = [];
  for (let m = Math.floor(def.workingTimeSec / 60); m >= 1; m--) {
    out.push(callout({ id: `wt:min:${m}`, atMs: times.endMs - m * 60_000, text: minutesText(m), tone: "minute", group: "minutes" }));
  }
  out.push(...countdown("wt:last", times.endMs, LAST_TEN, "lastSeconds"));
  out.push(callout({ id: "wt:end", atMs: times.endMs, text: "End of working time", tone: "end", group: "lastSeconds" }));
  return out.filter((c) => c.atMs >= times.startMs);
}

/**
 * Landing-window callouts (F3K.7: 30 s to land after the working time; F3K.9: its last 10 s
 * are counted down): its start, the countdown and its close. Only said while a model
 * launched inside the working time is still in the air — otherwise there is nothing to land.
 */
export function landingWindowCallouts(def: TaskDefinition, live: LiveState, times: WindowTimes): Callout[] {
  if (def.kind === "all-up" || def.landingWindowSec <= 0) return [];
  const airborne = live.lanes.some((lane) => lane.currentFlightMs !== null && live.nowMs - lane.currentFlightMs < times.endMs);
  if (!airborne) return [];
  const out: Callout[] = [
    callout({ id: "lw:start", atMs: times.endMs, text: `Landing window, ${def.landingWindowSec} seconds`, tone: "minute", group: "landingWindow" }),
    ...countdown("lw:last", times.landingEndMs, LAST_TEN, "landingWindow"),
    callout({ id: "lw:end", atMs: times.landingEndMs, text: "Landing window closed", tone: "end", group: "landingWindow" }),
  ];
  return out.filter((c) => c.atMs >= times.endMs);
}

/**
 * Task C: each attempt's landing window (3:03–3:33 after its signal: the launch allowance
 * plus the cap, up to the landing deadline), counted down while a model is in the air.
 */
export function allUpCallouts(def: TaskDefinition, live: LiveState): Callout[] {
  if (def.kind !== "all-up" || live.elapsedMs === null || live.attempt === null) return [];
  if (!live.lanes.some((lane) => lane.currentFlightMs !== null)) return [];
  const signalMs = live.nowMs - live.elapsedMs;
  const a = live.attempt.index;
  const openMs = signalMs + def.launchWindowMs + def.capSec * 1000;
  const deadlineMs = signalMs + def.landingDeadlineSec * 1000;
  const out: Callout[] = [];
  if (openMs < deadlineMs) out.push(callout({ id: `c${a}:lw:start`, atMs: openMs, text: "Landing window", tone: "minute", group: "landingWindow" }));
  out.push(...countdown(`c${a}:lw:last`, deadlineMs, LAST_TEN, "landingWindow"));
  out.push(callout({ id: `c${a}:lw:end`, atMs: deadlineMs, text: "Landing window closed", tone: "end", group: "landingWindow" }));
  return out.filter((c) => c.atMs >= signalMs);
}
