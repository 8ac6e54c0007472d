"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { getMeta, getWindowcallDb } from "@/lib/offline/db";

/** A run with its session and events, and what this phone knows about itself, read live from IndexedDB. */
export function useLogbookRun(runId: string | null) {
  return useLiveQuery(async () => {
    if (!runId) return { run: undefined, session: undefined, events: [], deviceId: null, estimate: null, profile: null };
    const db = getWindowcallDb();
    const run = await db.runs.get(runId);
    const session = run ? await db.sessions.get(run.sessionId) : undefined;
    const events = await db.events.where("runId").equals(runId).toArray();
    return {
      run,
      session,
      events,
      deviceId: (await getMeta(db, "deviceId")) ?? null,
      estimate: (await getMeta(db, "clockEstimate")) ?? null,
      profile: (await getMeta(db, "profile")) ?? null,
    };
  }, [runId]);
}
