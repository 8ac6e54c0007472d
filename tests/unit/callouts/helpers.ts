import { calloutsDue, type CalloutOptions } from "@/lib/callouts";
import { liveState, type TaskDefinition, type TimelineEvent } from "@/lib/tasks";

/** The callouts due in (prevMs, nowMs], with the live state taken at nowMs as the field screen does. */
export function due(def: TaskDefinition, events: readonly TimelineEvent[], prevMs: number, nowMs: number, options: CalloutOptions & { laneCount?: number } = {}) {
  return calloutsDue(def, liveState(def, events, nowMs, { laneCount: options.laneCount }), prevMs, options);
}

/** "atMs text" lines, easy to compare with a hand-worked list. */
export function said(callouts: readonly { atMs: number; text: string }[]): string[] {
  return callouts.map((c) => `${c.atMs} ${c.text}`);
}
