import type { TaskDefinition } from "./definition";

/**
 * The most a task can score and the per-slot maxima behind it, in tenths of a second.
 * A *slot* is one flight that counts, with its own maximum (a cap or a target).
 */

/** Per-slot maxima in tenths, or null when a window task counts any number of flights. */
export function slotCapsTenths(def: TaskDefinition): number[] | null {
  if (def.kind === "all-up") return Array.from({ length: def.attempts }, () => def.capSec * 10);
  if (def.kind === "poker") return Array.from({ length: def.maxTargets }, () => def.workingTimeSec * 10);
  if (def.ladder) return def.ladder.targetsSec.map((t) => t * 10);
  const slots = def.counting.rule === "all" ? def.launchLimit : def.counting.n;
  if (slots === null) return null;
  const cap = (def.capSec ?? def.workingTimeSec) * 10;
  return Array.from({ length: slots }, () => cap);
}

/** The F3K.7 sum cap for a given number of scored flights, or null when the task has none. */
export function sumCapTenths(def: TaskDefinition, scoredFlights: number): number | null {
  if (def.kind === "all-up" || !def.sumCap) return null;
  return Math.max(0, (def.workingTimeSec - scoredFlights) * 10);
}

/**
 * The task's maximum result in tenths: the best over k scored flights of
 * min(sum of the k largest slot maxima, sum cap for k) — F3K.7 makes fewer, longer
 * flights worth more when the window is the limit (task N: 599 s in 10 min).
 */
export function maxResultTenths(def: TaskDefinition): number {
  if (def.kind === "all-up") return def.attempts * def.capSec * 10;
  const caps = slotCapsTenths(def);
  const window = def.workingTimeSec * 10;
  const perSlot = def.kind === "window" ? (def.capSec ?? def.workingTimeSec) * 10 : window;
  const sorted = caps ? [...caps].sort((a, b) => b - a) : null;
  const kMax = sorted ? sorted.length : def.workingTimeSec;
  let best = 0;
  let sum = 0;
  for (let k = 1; k <= kMax; k++) {
    sum += sorted ? (sorted[k - 1] ?? 0) : perSlot;
    const cap = sumCapTenths(def, k);
    const value = Math.min(sum, cap ?? sum, window);
    if (value > best) best = value;
  }
  return best;
}

/**
 * True when the working time itself, not the slot maxima, limits the task (H, G, I, K, M, D,
 * E): every tenth on the ground then costs a tenth of result.
 */
export function isWindowBound(def: TaskDefinition): boolean {
  if (def.kind === "all-up") return false;
  const caps = slotCapsTenths(def);
  if (caps === null || def.kind === "poker") return true;
  return maxResultTenths(def) < caps.reduce((a, b) => a + b, 0);
}
