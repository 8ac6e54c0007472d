import type { EventBody } from "@/lib/events/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import type { TaskDefinition, TaskLetter } from "@/lib/tasks/definition";

/** The demo season's seeded random numbers (the same on every machine). */
export { mulberry32 as makeRandom } from "@/lib/random";

export type SimulatedEvent = { atOffsetMs: number; body: EventBody };

const PRACTICE_TASKS: TaskLetter[] = ["H", "B", "G", "K", "J", "A", "I", "F", "L", "N", "D"];

/** The task a demo run flies: a deterministic pick from a practice rotation. */
export function pickTask(random: () => number): TaskDefinition {
  const letter = PRACTICE_TASKS[Math.floor(random() * PRACTICE_TASKS.length)] ?? "H";
  return getCatalogueTask(letter);
}

function aimFor(task: TaskDefinition, flightIndex: number): number {
  if (task.kind !== "window") return 60;
  if (task.ladder) {
    const t = task.ladder.targetsSec;
    return t[task.ladder.order === "in-order" ? Math.min(flightIndex, t.length - 1) : t.length - 1 - (flightIndex % t.length)] ?? 60;
  }
  return task.capSec ?? 120;
}

/**
 * One pilot's window as taps: the working-time signal, then launch/landing pairs until the
 * working time is over, and the timekeeper closing the run after the landing window. Better pilots relaunch faster and land nearer their aim.
 */
export function simulateWindow(task: TaskDefinition, skill: number, random: () => number): SimulatedEvent[] {
  const out: SimulatedEvent[] = [{ atOffsetMs: 0, body: { kind: "window-start" } }];
  if (task.kind !== "window") return out;
  const endMs = task.workingTimeSec * 1000;
  const limit = task.launchLimit ?? 99;
  let t = Math.round((2 + random() * 6) * 1000);
  for (let i = 0; i < limit && t < endMs - 5000; i++) {
    const aim = aimFor(task, i) * 1000;
    const spread = (1 - skill) * 0.35 + 0.04;
    const flown = Math.max(8000, Math.round(aim * (1 - spread + random() * spread * 1.6)));
    out.push({ atOffsetMs: t, body: { kind: "launch", lane: 0 } });
    const land = Math.min(t + flown, endMs + 20_000);
    out.push({ atOffsetMs: land, body: { kind: "landing", lane: 0 } });
    t = land + Math.round((0.6 + (1 - skill) * 9 + random() * 4) * 1000);
  }
  const lastMs = out[out.length - 1]?.atOffsetMs ?? 0;
  out.push({ atOffsetMs: Math.max(lastMs, endMs + task.landingWindowSec * 1000) + 2000, body: { kind: "run-end" } });
  return out;
}
