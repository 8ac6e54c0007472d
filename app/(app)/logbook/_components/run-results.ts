import type { RunEvent } from "@/lib/events/schema";
import type { StoredRun } from "@/lib/offline/db";
import { phoneResult, type PhoneResult, type PhoneView } from "@/lib/offline/run-result";
import { parseTaskDefinition, type TaskDefinition } from "@/lib/tasks";

export type ScoredRun = ({ task: TaskDefinition } & PhoneResult) | { task: null; error: string };

/**
 * A stored run scored on this device by its own stored task definition (not the catalogue's
 * current one) through the one result function, as the field screen and the server score it.
 */
export function scoreStoredRun(run: StoredRun, events: readonly RunEvent[], view: PhoneView): ScoredRun {
  let task: TaskDefinition;
  try {
    task = parseTaskDefinition(run.task);
  } catch {
    return { task: null, error: "This run's task definition cannot be read on this device." };
  }
  return { task, ...phoneResult(run, task, events, view) };
}

/** "Task G · Five longest flights", or the custom task's name. */
export function taskTitle(task: TaskDefinition): string {
  return task.letter ? `${task.letter} · ${task.name}` : task.name;
}
