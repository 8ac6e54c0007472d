import { wasStarted } from "@/lib/results";
import { getMeta, type WindowcallDb } from "./db";
import { enqueue } from "./record";

export type DiscardOutcome = "deleted" | "started" | "missing";

/**
 * Deletes a window that was set up but never started from this phone, in one transaction: the
 * run, its events (undone taps, at most), their unsent outbox entries, and its session when no
 * other run uses it. A started window is never deleted (its events are the record; SYNC.md §1).
 *
 * A run this account set up also queues its deletion for the server ("discard", by the run's
 * id), which removes it there and tells every phone that pulled it to drop it. The server may
 * already hold the run even when its entry was still queued here (a push in flight), so the
 * deletion is always sent; a run the server never saw is simply acknowledged. A run someone
 * else recorded (its pulled `recordedBy` is not this account) is only removed from this phone:
 * it is theirs to delete.
 */
export async function discardUnstartedRun(db: WindowcallDb, runId: string, now: () => number = Date.now): Promise<DiscardOutcome> {
  return db.transaction("rw", [db.runs, db.events, db.outbox, db.sessions, db.meta], async () => {
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
    const me = (await getMeta(db, "profile"))?.id;
    if (!run.recordedBy || me === undefined || run.recordedBy.id === me) await enqueue(db, runId, "discard", now());
    return "deleted";
  });
}
