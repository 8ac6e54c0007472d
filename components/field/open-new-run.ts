"use client";

import { getWindowcallDb } from "@/lib/offline/db";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { createRunLocal, createSessionLocal } from "@/lib/offline/record";
import { isQuotaError } from "@/lib/offline/storage";

/**
 * Stores a new field session and its run on the phone (each with its outbox entry), lets `stored`
 * keep what belongs to the run on the phone (last field, plan progress…), tells sync (`notify`),
 * and opens the field timer with a full navigation: offline, the service worker serves the one
 * precached run shell. Every way of starting a window goes through here (the form, a coach's plan
 * item, a contest duty). Resolves with the sentence to show when nothing could be saved.
 */
export async function openNewRun(
  session: Omit<SessionEntity, "id">,
  run: Omit<RunEntity, "id" | "sessionId">,
  options: { notify: () => void; stored?: (run: RunEntity) => void },
): Promise<string> {
  try {
    const db = getWindowcallDb();
    const saved = await createSessionLocal(db, session);
    const created = await createRunLocal(db, { ...run, sessionId: saved.id });
    options.stored?.(created);
    options.notify();
    // eslint-disable-next-line @next/next/no-location-assign-relative-destination
    window.location.assign(`/field/run?id=${created.id}`);
    return "";
  } catch (e) {
    return isQuotaError(e) ? "The phone's storage is full: nothing was saved. Free some space and try again." : `Nothing was saved: ${e instanceof Error ? e.message : String(e)}`;
  }
}
