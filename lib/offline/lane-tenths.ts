import type { RunEvent } from "@/lib/events/schema";
import type { TaskDefinition } from "@/lib/tasks";
import type { StoredRun } from "./db";
import { phoneRunResult, type PhoneView } from "./run-result";

type Scored = Pick<StoredRun, "id" | "lanes" | "recordedBy" | "task">;

/**
 * Lane results of runs (phoneRunResult: the one result function), remembered with what they were
 * computed from, so a list that re-reads the device database re-scores only the runs whose events
 * (or this phone's view of them) changed. `retain` forgets runs no longer listed, so the memory
 * holds at most the listed runs however many come and go.
 */
export class LaneTenthsMemo {
  private readonly scored = new Map<string, { from: string; tenths: (number | null)[] }>();

  tenths(run: Scored, task: TaskDefinition, events: readonly RunEvent[], view: PhoneView): (number | null)[] {
    // Events never change once written, except that a pulled copy names its recorder.
    const from = JSON.stringify([view, run.lanes, run.recordedBy?.id ?? null, run.task, events.map((e) => `${e.id}:${e.recordedBy ?? ""}`)]);
    const hit = this.scored.get(run.id);
    if (hit?.from === from) return hit.tenths;
    const tenths = phoneRunResult(run, task, events, view).lanes.map((l) => l.resultTenths);
    this.scored.set(run.id, { from, tenths });
    return tenths;
  }

  /** Keep only these runs' results. */
  retain(runIds: Iterable<string>): void {
    const keep = new Set(runIds);
    for (const id of this.scored.keys()) if (!keep.has(id)) this.scored.delete(id);
  }

  get size(): number {
    return this.scored.size;
  }
}
