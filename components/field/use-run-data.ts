"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { useEffect, useState } from "react";
import type { ClockEstimate } from "@/lib/clock";
import type { RunEvent } from "@/lib/events/schema";
import { getMeta, getWindowcallDb } from "@/lib/offline/db";
import { getDeviceId } from "@/lib/offline/device";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { parseTaskDefinition, type TaskDefinition } from "@/lib/tasks";

export type RunData =
  | { state: "loading" }
  | { state: "missing" }
  | { state: "broken"; message: string }
  | {
      state: "ready";
      run: RunEntity;
      session: SessionEntity | undefined;
      task: TaskDefinition;
      events: RunEvent[];
      deviceId: string;
      estimate: ClockEstimate | null;
    };

/** A run, its session and its events, read live from the device's database (never from caches). */
export function useRunData(runId: string | null): RunData {
  const db = getWindowcallDb();
  const [deviceId, setDeviceId] = useState<string | null>(null);
  useEffect(() => {
    void getDeviceId(db).then(setDeviceId);
  }, [db]);
  const loaded = useLiveQuery(async () => {
    if (!runId) return { run: undefined, session: undefined, events: [] as RunEvent[], estimate: null };
    const run = await db.runs.get(runId);
    const session = run ? await db.sessions.get(run.sessionId) : undefined;
    const events = await db.events.where("runId").equals(runId).toArray();
    const estimate = (await getMeta(db, "clockEstimate")) ?? null;
    return { run, session, events, estimate };
  }, [db, runId]);

  if (!runId) return { state: "missing" };
  if (!loaded || !deviceId) return { state: "loading" };
  if (!loaded.run) return { state: "missing" };
  let task: TaskDefinition;
  try {
    task = parseTaskDefinition(loaded.run.task);
  } catch {
    return { state: "broken", message: "This run's task definition cannot be read on this device." };
  }
  return { state: "ready", run: loaded.run, session: loaded.session, task, events: loaded.events, deviceId, estimate: loaded.estimate };
}
