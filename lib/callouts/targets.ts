import type { LaneLive, LiveState, TaskDefinition } from "@/lib/tasks";
import { callout, countdown, LAST_FIVE } from "./countdown";
import type { Callout } from "./types";

/** What the flight in the air is flying toward: a target (ladders, poker) or the cap. */
export type FlightGoal = { sec: number; word: "target" | "max" };

/**
 * The goal of a lane's flight launched at `launchMs`, or null when it has none.
 * - In-order ladders (K, M) and poker (E): the step's / the announced target (the engine's
 *   `nextTargetSec`).
 * - Any-order ladders (H): the longest target still open that fits between the launch and
 *   the end of working time — the target the screen suggested at the launch, frozen for the
 *   flight (the engine's suggestion re-evaluated later would drop 4:00 mid-flight as the
 *   window shrinks, though the flight can still reach it).
 * - Other tasks: the cap ("max"), when the task has one.
 */
export function flightGoal(def: TaskDefinition, lane: LaneLive, launchMs: number, endMs: number): FlightGoal | null {
  if (def.kind === "all-up") return { sec: def.capSec, word: "max" };
  if (def.kind === "poker") return lane.nextTargetSec === null ? null : { sec: lane.nextTargetSec, word: "target" };
  if (def.ladder?.order === "in-order") return lane.nextTargetSec === null ? null : { sec: lane.nextTargetSec, word: "target" };
  if (def.ladder) {
    const open = [...lane.remainingTargetsSec].sort((a, b) => b - a);
    const fits = open.find((t) => launchMs + t * 1000 <= endMs);
    return fits === undefined ? null : { sec: fits, word: "target" };
  }
  return def.capSec === null ? null : { sec: def.capSec, word: "max" };
}

/**
 * Target countdowns for every lane with a model in the air: "10 to target" 10 s before, then
 * 5 … 1, then "target" at the target (or "max" at a cap). Only for flights launched inside
 * the working time (task C: at or after the signal) whose goal falls before time stops
 * counting. With several lanes each callout starts with the lane's name.
 */
export function targetCallouts(def: TaskDefinition, live: LiveState, laneNames: readonly string[] = []): Callout[] {
  if (live.elapsedMs === null) return [];
  const startMs = live.nowMs - live.elapsedMs;
  const endMs = def.kind === "all-up" ? startMs + def.landingDeadlineSec * 1000 : startMs + def.workingTimeSec * 1000;
  const out: Callout[] = [];
  for (const lane of live.lanes) {
    if (lane.currentFlightMs === null) continue;
    const launchMs = live.nowMs - lane.currentFlightMs;
    if (launchMs < startMs || launchMs >= endMs) continue;
    const goal = flightGoal(def, lane, launchMs, endMs);
    if (!goal) continue;
    const atMs = launchMs + goal.sec * 1000;
    if (atMs > endMs) continue;
    const prefix = live.lanes.length > 1 ? `${laneNames[lane.lane] ?? `Lane ${lane.lane + 1}`}: ` : "";
    // The launch instant keys the flight: an undone and retaken launch is a new flight.
    const key = `target:${lane.lane}:${Math.round(launchMs)}:${goal.sec}`;
    const counts = countdown(key, atMs, LAST_FIVE, "targets", { lane: lane.lane, label: (k) => `${prefix}${k}` });
    const lead = callout({ id: `${key}:10`, atMs: atMs - 10_000, text: `${prefix}10 to ${goal.word}`, tone: "tick", group: "targets", lane: lane.lane });
    const hit = callout({ id: `${key}:0`, atMs, text: `${prefix}${goal.word}`, tone: "target", group: "targets", lane: lane.lane });
    out.push(...[lead, ...counts, hit].filter((c) => c.atMs > launchMs));
  }
  return out;
}
