import type { TaskDefinition } from "./definition";

/**
 * Whether every flight of the task is launched at a start signal, so the time on the ground before a
 * launch is the wait for that signal and not the pilot's turnaround: an all-up task (task C: one
 * attempt per signal, launched within 3 s of it, with 60 s of preparation between attempts —
 * RULES.md, F3K.11 "Task C details"). Window and poker tasks leave each relaunch to the pilot.
 * The Season's SQL reads the same test of the stored task (db/queries/season/turnaround.ts flightsOnSignal).
 */
export function flightsStartOnSignal(def: Pick<TaskDefinition, "kind">): boolean {
  return def.kind === "all-up";
}
