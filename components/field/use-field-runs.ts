"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { isRunOpen } from "@/lib/field/lane-tap";
import { getMeta, getWindowcallDb, type StoredRun } from "@/lib/offline/db";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import type { RunEvent } from "@/lib/events/schema";
import { phoneResult, type PhoneView } from "@/lib/offline/run-result";
import { wasStarted } from "@/lib/results";
import { parseTaskDefinition, type TaskDefinition } from "@/lib/tasks";

export type FieldRunRow = {
  run: RunEntity;
  session: SessionEntity | undefined;
  task: TaskDefinition | null;
  open: boolean;
  started: boolean;
  /** Per lane result in tenths (finished runs; null: no result, e.g. a lane nobody timed). */
  resultsTenths: (number | null)[];
};

const RECENT = 30;

/**
 * Lane results of finished runs, by run id, with what they were computed from: the field's two
 * lists share one scoring per run, and a pull that stores more records re-scores only the runs
 * whose events (or this phone's view of them) changed.
 */
const scored = new Map<string, { from: string; tenths: (number | null)[] }>();

function laneTenths(run: StoredRun, task: TaskDefinition, events: readonly RunEvent[], view: PhoneView): (number | null)[] {
  // Events never change once written, except that a pulled copy names its recorder.
  const from = JSON.stringify([view, run.lanes, run.recordedBy?.id ?? null, run.task, events.map((e) => `${e.id}:${e.recordedBy ?? ""}`)]);
  const hit = scored.get(run.id);
  if (hit?.from === from) return hit.tenths;
  const tenths = phoneResult(run, task, events, view).lanes.map((l) => l.resultTenths);
  scored.set(run.id, { from, tenths });
  return tenths;
}

/** The device's newest runs (its own and pulled ones), split by whether they are still open. */
export function useFieldRuns(): FieldRunRow[] | undefined {
  return useLiveQuery(async () => {
    const db = getWindowcallDb();
    const runs = (await db.runs.toArray()).sort((a, b) => b.createdAtWallMs - a.createdAtWallMs).slice(0, RECENT);
    const view: PhoneView = {
      deviceId: (await getMeta(db, "deviceId")) ?? null,
      me: (await getMeta(db, "profile"))?.id ?? null,
      estimate: (await getMeta(db, "clockEstimate")) ?? null,
    };
    return Promise.all(
      runs.map(async (run): Promise<FieldRunRow> => {
        const [session, events] = await Promise.all([db.sessions.get(run.sessionId), db.events.where("runId").equals(run.id).toArray()]);
        let task: TaskDefinition | null = null;
        try {
          task = parseTaskDefinition(run.task);
        } catch {
          task = null;
        }
        const open = isRunOpen(events);
        const resultsTenths = task && !open ? laneTenths(run, task, events, view) : [];
        return { run, session, task, open, started: wasStarted(events), resultsTenths };
      }),
    );
  }, []);
}
