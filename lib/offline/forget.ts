import { getMeta, type WindowcallDb } from "./db";

/**
 * Drop the runs a pull says this device may no longer see (pullReplySchema.forget: a coach's
 * copies after a revoked grant or a lane the pilot hid), with their events and any session of
 * someone else's that no kept run needs any more. Nothing still waiting in the outbox is
 * dropped: the device's own unsent records are never lost. Call inside a transaction over
 * runs, events, sessions, outbox and meta. Returns how many runs were dropped.
 */
export async function forgetRuns(db: WindowcallDb, runIds: readonly string[], account: string | null): Promise<number> {
  if (runIds.length === 0) return 0;
  const me = (await getMeta(db, "profile"))?.id ?? account;
  const pending = new Set((await db.outbox.toArray()).map((o) => o.id));
  const runs = (await db.runs.bulkGet([...runIds])).filter((r) => r !== undefined && !pending.has(r.id));
  if (runs.length === 0) return 0;
  const dropped = new Set(runs.map((r) => r!.id));
  const events = await db.events.where("runId").anyOf([...dropped]).primaryKeys();
  await db.events.bulkDelete(events.filter((id) => !pending.has(id)));
  await db.runs.bulkDelete([...dropped]);
  for (const sessionId of new Set(runs.map((r) => r!.sessionId))) {
    const session = await db.sessions.get(sessionId);
    if (!session || me === null || session.ownerId === me || pending.has(sessionId)) continue;
    if ((await db.runs.where("sessionId").equals(sessionId).count()) === 0) await db.sessions.delete(sessionId);
  }
  return dropped.size;
}

/**
 * Drop the events of lanes a pull says this device may no longer see in runs it keeps
 * (pullReplySchema.forgetLanes): each lane's own events and every undo or correction that amends
 * one of them (followed through undos of undos). The run's row itself comes again in the same
 * pull with only the lanes it may see. Nothing still waiting in the outbox is dropped. Call
 * inside a transaction over events and outbox. Returns how many events were dropped.
 */
export async function forgetLanes(db: WindowcallDb, lost: readonly { runId: string; lanes: readonly number[] }[]): Promise<number> {
  if (lost.length === 0) return 0;
  const pending = new Set((await db.outbox.toArray()).map((o) => o.id));
  let dropped = 0;
  for (const { runId, lanes } of lost) {
    const gone = new Set(lanes);
    const events = await db.events.where("runId").equals(runId).toArray();
    const bodyOf = new Map(events.map((e) => [e.id, e.body]));
    const drop = events.filter((e) => {
      let body: (typeof e)["body"] | undefined = e.body;
      for (let hops = 0; body && "targetId" in body && hops < 64; hops++) body = bodyOf.get(body.targetId);
      return body !== undefined && "lane" in body && gone.has(body.lane) && !pending.has(e.id);
    });
    await db.events.bulkDelete(drop.map((e) => e.id));
    dropped += drop.length;
  }
  return dropped;
}
