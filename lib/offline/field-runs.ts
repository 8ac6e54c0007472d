import { isRunOpen } from "@/lib/field/lane-tap";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import type { RunEvent } from "@/lib/events/schema";
import { wasStarted } from "@/lib/results";
import { parseTaskDefinition, type TaskDefinition } from "@/lib/tasks";
import type { WindowcallDb } from "./db";
import { LaneTenthsMemo } from "./lane-tenths";
import { readPhoneView } from "./run-result";

export type FieldRunRow = {
  run: RunEntity;
  session: SessionEntity | undefined;
  task: TaskDefinition | null;
  started: boolean;
  /** Per lane result in tenths (null: no result, e.g. a lane nobody timed); [] for an open window. */
  resultsTenths: (number | null)[];
};

/** What /field shows: windows still open, and the latest finished ones (set up but never started: left out) with results. */
export type FieldRuns = { open: FieldRunRow[]; recent: FieldRunRow[] };

/** Newest runs read: open windows are looked for among these. */
export const FIELD_RUNS_READ = 30;
/** Finished windows listed (and so scored) under "Recent results". */
export const RECENT_SHOWN = 10;

/**
 * Reads /field's runs, remembering between reads what a re-read can reuse: each write of the first pull wakes
 * this query (issue #10), and each wake-up had re-parsed 30 task definitions with zod, re-scored every finished
 * run of the 30 though 10 are shown, and read each run's session and events in two transactions of their own.
 * Now: two reads for all of them, a task parsed once per run (and again only if it changes), and only the
 * listed finished runs scored (LaneTenthsMemo: again only when their events change).
 */
export class FieldRunsReader {
  private readonly scored = new LaneTenthsMemo();
  private readonly tasks = new Map<string, { from: string; task: TaskDefinition | null }>();

  async read(db: WindowcallDb): Promise<FieldRuns> {
    const runs = (await db.runs.toArray()).sort((a, b) => b.createdAtWallMs - a.createdAtWallMs).slice(0, FIELD_RUNS_READ);
    const view = await readPhoneView(db);
    const ids = runs.map((r) => r.id);
    this.scored.retain(ids);
    const keep = new Set(ids);
    for (const id of this.tasks.keys()) if (!keep.has(id)) this.tasks.delete(id);
    const [sessions, events] = await Promise.all([
      db.sessions.bulkGet([...new Set(runs.map((r) => r.sessionId))]),
      db.events.where("runId").anyOf(ids).toArray(),
    ]);
    const sessionById = new Map(sessions.flatMap((s) => (s ? [[s.id, s] as const] : [])));
    const eventsByRun = new Map<string, RunEvent[]>();
    for (const e of events) {
      const list = eventsByRun.get(e.runId);
      if (list) list.push(e);
      else eventsByRun.set(e.runId, [e]);
    }
    const out: FieldRuns = { open: [], recent: [] };
    for (const run of runs) {
      const runEvents = eventsByRun.get(run.id) ?? [];
      const open = isRunOpen(runEvents);
      const started = wasStarted(runEvents);
      if (!open && (!started || out.recent.length >= RECENT_SHOWN)) continue;
      const task = this.taskOf(run);
      const row: FieldRunRow = { run, session: sessionById.get(run.sessionId), task, started, resultsTenths: [] };
      if (open) out.open.push(row);
      else {
        if (task) row.resultsTenths = this.scored.tenths(run, task, runEvents, view);
        out.recent.push(row);
      }
    }
    return out;
  }

  private taskOf(run: RunEntity): TaskDefinition | null {
    const from = JSON.stringify(run.task);
    const hit = this.tasks.get(run.id);
    if (hit?.from === from) return hit.task;
    let task: TaskDefinition | null = null;
    try {
      task = parseTaskDefinition(run.task);
    } catch {
      task = null;
    }
    this.tasks.set(run.id, { from, task });
    return task;
  }
}
