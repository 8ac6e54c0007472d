"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { isRunOpen } from "@/lib/field/lane-tap";
import { buildTimeline } from "@/lib/field/timeline";
import { getMeta, getWindowcallDb } from "@/lib/offline/db";
import { getPageId } from "@/lib/offline/device";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { foldRun, parseTaskDefinition, type TaskDefinition } from "@/lib/tasks";

export type FieldRunRow = {
  run: RunEntity;
  session: SessionEntity | undefined;
  task: TaskDefinition | null;
  open: boolean;
  started: boolean;
  /** Per lane result in tenths (finished runs). */
  resultsTenths: number[];
};

const RECENT = 30;

/** The device's newest runs (its own and pulled ones), split by whether they are still open. */
export function useFieldRuns(): FieldRunRow[] | undefined {
  return useLiveQuery(async () => {
    const db = getWindowcallDb();
    const runs = (await db.runs.toArray()).sort((a, b) => b.createdAtWallMs - a.createdAtWallMs).slice(0, RECENT);
    const deviceId = (await getMeta(db, "deviceId")) ?? "";
    const ctx = { deviceId, pageId: getPageId(), wallNow: Date.now(), monoNow: performance.now(), thetaMs: null };
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
        const timeline = buildTimeline(events, ctx);
        const resultsTenths = task && !open ? foldRun(task, timeline, { laneCount: run.lanes.length }).lanes.map((l) => l.resultTenths) : [];
        return { run, session, task, open, started: events.some((e) => e.body.kind === "window-start"), resultsTenths };
      }),
    );
  }, []);
}
