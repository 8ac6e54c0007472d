import type { LiveState, TaskDefinition } from "@/lib/tasks";
import { planCallouts } from "./plan";
import { targetCallouts } from "./targets";
import type { Callout, CalloutTone, StartPlan } from "./types";
import { allUpCallouts, landingWindowCallouts, windowTimes, workingTimeCallouts } from "./window-clock";

export type CalloutOptions = {
  /** Pilot names by lane number, used as a prefix when several lanes fly. */
  laneNames?: readonly string[];
  /** A planned start with preparation and no-fly period, if the run has one. */
  plan?: StartPlan | null;
};

// When two callouts fall on one instant, the more urgent is said first.
const URGENCY: Record<CalloutTone, number> = { end: 0, target: 1, tick: 2, minute: 3 };

/**
 * Every callout the run has, worked out from the live state at `live.nowMs` (times on the
 * run's timeline). Callouts that depend on a model being in the air (targets, landing
 * window) are those of the flights in the air at `live.nowMs`.
 */
export function allCallouts(definition: TaskDefinition, live: LiveState, options: CalloutOptions = {}): Callout[] {
  const out: Callout[] = [];
  if (options.plan) out.push(...planCallouts(options.plan));
  const times = windowTimes(definition, live);
  if (times) out.push(...workingTimeCallouts(definition, times), ...landingWindowCallouts(definition, live, times));
  out.push(...allUpCallouts(definition, live), ...targetCallouts(definition, live, options.laneNames));
  return out.sort((a, b) => a.atMs - b.atMs || URGENCY[a.tone] - URGENCY[b.tone] || a.id.localeCompare(b.id));
}

/**
 * The callouts due in (prevMs, live.nowMs], in the order to say them. Deterministic: the
 * same inputs give the same callouts with the same ids, so a caller that remembers the ids
 * it has said never repeats one (after a reload, a frame skip or a re-render).
 */
export function calloutsDue(definition: TaskDefinition, live: LiveState, prevMs: number, options: CalloutOptions = {}): Callout[] {
  if (!(live.nowMs > prevMs)) return [];
  return allCallouts(definition, live, options).filter((c) => c.atMs > prevMs && c.atMs <= live.nowMs);
}

/**
 * Drops callouts that are more than `maxAgeMs` late (the page slept or was hidden): a
 * count of "7" heard three seconds late misleads more than silence.
 */
export function freshCallouts(due: readonly Callout[], nowMs: number, maxAgeMs = 1500): Callout[] {
  return due.filter((c) => nowMs - c.atMs <= maxAgeMs);
}
