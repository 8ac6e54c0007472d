import { isDeepStrictEqual } from "node:util";
import type { Database } from "@/db";
import { listChanges } from "@/db/queries/sync-pull";
import { storedRunOf } from "@/lib/offline/pull";
import { serverEvents, type SimWorld } from "./sync-sim";

/**
 * The invariants of SYNC.md §5 after a world has settled, as a list of violations (empty = ok):
 * nothing left unsent, nothing refused (every simulated write is allowed), every event a
 * device recorded on the server exactly once (same ids, same (device, seq)), and every
 * device's database equal to the server's view for its user (one full pull).
 */
export async function checkWorld(db: Database, world: SimWorld): Promise<string[]> {
  const problems: string[] = [];
  const rows = await serverEvents(db, world.devices.map((d) => d.deviceId));
  const seqKeys = rows.map((r) => `${r.device_id}#${r.seq}`);
  if (new Set(seqKeys).size !== seqKeys.length) problems.push("a (device, seq) is stored twice");

  for (const [i, d] of world.devices.entries()) {
    const outbox = await d.db.outbox.toArray();
    const pending = outbox.filter((e) => !e.rejected);
    const refused = outbox.filter((e) => e.rejected);
    if (pending.length > 0) problems.push(`device ${i}: ${pending.length} items never acknowledged`);
    for (const r of refused) problems.push(`device ${i}: ${r.kind} refused: ${r.rejected!.reason}`);

    const own = (await d.db.events.toArray()).filter((e) => e.deviceId === d.deviceId);
    const onServer = rows.filter((r) => r.device_id === d.deviceId);
    const ownIds = new Set(own.map((e) => `${e.id}#${e.seq}`));
    const serverIds = new Set(onServer.map((r) => `${r.id}#${r.seq}`));
    const lost = [...ownIds].filter((k) => !serverIds.has(k));
    const extra = [...serverIds].filter((k) => !ownIds.has(k));
    if (lost.length) problems.push(`device ${i}: ${lost.length} events lost`);
    if (extra.length) problems.push(`device ${i}: ${extra.length} events on the server it never recorded`);

    const view = await fullView(db, d.user.id);
    const local = {
      sessions: new Map((await d.db.sessions.toArray()).map((s) => [s.id, s])),
      runs: new Map((await d.db.runs.toArray()).map((r) => [r.id, r])),
      events: new Map((await d.db.events.toArray()).map((e) => [e.id, e])),
    };
    for (const kind of ["sessions", "runs", "events"] as const) {
      const mine = local[kind] as Map<string, unknown>;
      const theirs = view[kind] as Map<string, unknown>;
      if (mine.size !== theirs.size) problems.push(`device ${i}: ${mine.size} ${kind} locally, ${theirs.size} in the server's view`);
      for (const [id, value] of theirs) {
        if (!isDeepStrictEqual(JSON.parse(JSON.stringify(mine.get(id) ?? null)), JSON.parse(JSON.stringify(value)))) {
          problems.push(`device ${i}: ${kind} ${id} differs from the server`);
          break;
        }
      }
    }
  }
  return problems;
}

/** Everything the user may see, as one pull from cursor 0 would deliver it. */
async function fullView(db: Database, userId: string) {
  const sessions = new Map<string, unknown>();
  const runs = new Map<string, unknown>();
  const events = new Map<string, unknown>();
  let cursor = "0";
  for (let more = true; more; ) {
    const page = await listChanges(db, { userId, cursor });
    for (const item of page.items) {
      if (item.type === "session") sessions.set(item.data.id, item.data);
      else if (item.type === "event") events.set(item.data.id, item.data);
      else {
        if (item.session) sessions.set(item.session.id, item.session);
        runs.set(item.data.id, storedRunOf(item));
      }
    }
    cursor = page.nextCursor;
    more = page.hasMore;
  }
  return { sessions, runs, events };
}
