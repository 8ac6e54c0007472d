import type { ClockEstimate } from "@/lib/clock";
import type { RunEvent } from "@/lib/events/schema";
import { buildTimeline } from "@/lib/field/timeline";
import { getPageId } from "@/lib/offline/device";
import type { RunEntity } from "@/lib/events/entities";
import { foldRun, parseTaskDefinition, type FoldedRun, type TaskDefinition, type TimelineEvent } from "@/lib/tasks";

export type ScoredRun = { task: TaskDefinition; timeline: TimelineEvent[]; folded: FoldedRun } | { task: null; error: string };

/**
 * A stored run scored on this device: its own stored task definition (not the catalogue's
 * current one), its events placed on one timeline as the field screen places them, folded
 * by the task engine. Browser only (reads the page's monotonic clock).
 */
export function scoreStoredRun(run: RunEntity, events: readonly RunEvent[], deviceId: string | null, estimate: ClockEstimate | null): ScoredRun {
  let task: TaskDefinition;
  try {
    task = parseTaskDefinition(run.task);
  } catch {
    return { task: null, error: "This run's task definition cannot be read on this device." };
  }
  const ctx = { deviceId: deviceId ?? "", pageId: getPageId(), wallNow: Date.now(), monoNow: performance.now(), thetaMs: estimate?.thetaMs ?? null };
  const timeline = buildTimeline(events, ctx);
  return { task, timeline, folded: foldRun(task, timeline, { laneCount: run.lanes.length }) };
}

/** "Task G · Five longest flights", or the custom task's name. */
export function taskTitle(task: TaskDefinition): string {
  return task.letter ? `${task.letter} · ${task.name}` : task.name;
}
