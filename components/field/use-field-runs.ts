"use client";

import { useSyncExternalStore } from "react";
import { isRunOpen } from "@/lib/field/lane-tap";
import { getMeta, getWindowcallDb } from "@/lib/offline/db";
import { LaneTenthsMemo } from "@/lib/offline/lane-tenths";
import { sharedLiveQuery } from "@/lib/offline/shared-live-query";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import type { PhoneView } from "@/lib/offline/run-result";
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

/** The field's lane results, re-scored only for runs whose events changed (lib/offline/lane-tenths.ts). */
const scored = new LaneTenthsMemo();

/**
 * The device's newest runs (its own and pulled ones), split by whether they are still open. One
 * query for the whole page: /field's open windows and recent results both show it, and each
 * write while the page loads (the first pull) re-reads and re-scores it once, not once each.
 */
const fieldRuns = sharedLiveQuery(readFieldRuns);

export function useFieldRuns(): FieldRunRow[] | undefined {
  return useSyncExternalStore(fieldRuns.subscribe, fieldRuns.getSnapshot, () => undefined);
}

async function readFieldRuns(): Promise<FieldRunRow[]> {
  const db = getWindowcallDb();
  const runs = (await db.runs.toArray()).sort((a, b) => b.createdAtWallMs - a.createdAtWallMs).slice(0, RECENT);
  const view: PhoneView = {
    deviceId: (await getMeta(db, "deviceId")) ?? null,
    me: (await getMeta(db, "profile"))?.id ?? null,
    estimate: (await getMeta(db, "clockEstimate")) ?? null,
  };
  scored.retain(runs.map((r) => r.id));
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
      const resultsTenths = task && !open ? scored.tenths(run, task, events, view) : [];
      return { run, session, task, open, started: wasStarted(events), resultsTenths };
    }),
  );
}
