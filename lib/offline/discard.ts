import { wasStarted } from "@/lib/results";
import type { WindowcallDb } from "./db";

export type DiscardOutcome = "deleted" | "started" | "missing";

/**
 * Deletes a window that was set up but never started from this phone, in one transaction: the
 * run, its events (undone taps, at most), their unsent outbox entries, and its session when no
 * other run uses it. A started window is never deleted (its events are the record; SYNC.md §1).
 */
export async function discardUnstartedRun(db: WindowcallDb, runId: string): Promise<DiscardOutcome> {
  return db.transaction("rw", [db.runs, db.events, db.outbox, db.sessions], async () => {
    const run = await db.runs.get(runId);
    if (!run) return "missing";
    const events = await db.events.where("runId").equals(runId).toArray();
    if (wasStarted(events)) return "started";
    const ids = [runId, ...events.map((e) => e.id)];
    const others = await db.runs.where("sessionId").equals(run.sessionId).count();
    if (others === 1) ids.push(run.sessionId);
    await db.outbox.bulkDelete(ids);
    await db.events.bulkDelete(events.map((e) => e.id));
    await db.runs.delete(runId);
    if (others === 1) await db.sessions.delete(run.sessionId);
    return "deleted";
  });
}
