import { v7 as uuidv7 } from "uuid";
import { describe, expect, it } from "vitest";
import { getMeta, setMeta } from "@/lib/offline/db";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { forgetLanes } from "@/lib/offline/forget";
import { SyncClient } from "@/lib/offline/sync-client";
import { FakeServer, freshDbsPerTest, ManualTimers, stamp } from "./helpers";

const open = freshDbsPerTest();

const PILOT = "0190a7c2-0000-7000-8000-00000000000a";
const COACH = "0190a7c2-0000-7000-8000-00000000000c";

/** A pilot's phone pushes two runs in two sessions; returns the server and the ids. */
async function pilotRecords() {
  const server = new FakeServer();
  const phone = open();
  const ids = [];
  for (const field of ["North", "South"]) {
    const session = await createSessionLocal(phone, { ownerId: PILOT, fieldName: field, conditions: {}, startedAtWallMs: 1 });
    const run = await createRunLocal(phone, { sessionId: session.id, task: {}, lanes: [{ lane: 0, pilotName: "P", pilotUserId: PILOT }], createdAtWallMs: 2 });
    await recordEvent(phone, { runId: run.id, body: { kind: "launch", lane: 0 }, stamp: stamp() });
    ids.push({ session: session.id, run: run.id });
  }
  await new SyncClient({ db: phone, fetch: server.fetch, timers: new ManualTimers() }).flush();
  return { server, ids };
}

describe("a coach's phone forgets what the pull names", () => {
  it("drops the named run, its events and the pilot's session it no longer needs; keeps everything else", async () => {
    const { server, ids } = await pilotRecords();
    const db = open();
    await setMeta(db, "profile", { id: COACH, name: "Coach", email: "c@example.com" });
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers(), account: () => COACH });
    await client.pull();
    expect(await db.runs.count()).toBe(2);

    server.forget = [ids[0]!.run, uuidv7()]; // one it holds, one it never had
    server.scope = "grant revoked";
    await client.pull(); // the scope changed: from the start, where the forget list comes
    expect(await db.runs.get(ids[0]!.run)).toBeUndefined();
    expect(await db.events.where("runId").equals(ids[0]!.run).count()).toBe(0);
    expect(await db.sessions.get(ids[0]!.session)).toBeUndefined();
    expect(await db.runs.get(ids[1]!.run)).toBeDefined();
    expect(await db.sessions.get(ids[1]!.session)).toBeDefined();
    expect(await getMeta(db, "pullScope")).toBe("grant revoked");
  });

  it("never drops the device's own unsent records, nor a session the user owns", async () => {
    const { server, ids } = await pilotRecords();
    const db = open();
    await setMeta(db, "profile", { id: COACH, name: "Coach", email: "c@example.com" });
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers(), account: () => COACH });
    server.failures = [];
    await client.pull();
    // a run of the coach's own, in the coach's own session, still in the outbox
    const session = await createSessionLocal(db, { ownerId: COACH, fieldName: "Mine", conditions: {}, startedAtWallMs: 1 });
    const mine = await createRunLocal(db, { sessionId: session.id, task: {}, lanes: [{ lane: 0, pilotName: "C", pilotUserId: COACH }], createdAtWallMs: 2 });
    const tap = await recordEvent(db, { runId: mine.id, body: { kind: "window-start" }, stamp: stamp() });
    server.forget = [mine.id, ids[1]!.run];
    server.failures = [];
    await setMeta(db, "pullCursor", "0");
    await client.pull();
    expect(await db.runs.get(mine.id)).toBeDefined();
    expect(await db.events.get(tap.id)).toBeDefined();
    expect(await db.sessions.get(session.id)).toBeDefined();
    expect(await db.runs.get(ids[1]!.run)).toBeUndefined();
  });
});

describe("a phone forgets the lanes the pull names", () => {
  it("drops a lost lane's events and the undos that amend them; keeps other lanes and its own unsent taps", async () => {
    const { server, ids } = await pilotRecords();
    const db = open();
    await setMeta(db, "profile", { id: COACH, name: "Coach", email: "c@example.com" });
    await new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers(), account: () => COACH }).pull();
    const runId = ids[0]!.run;
    const pulled = await db.events.where("runId").equals(runId).toArray();
    expect(pulled.map((e) => e.body.kind)).toEqual(["launch"]);
    // this phone also holds another lane's tap and an undo of the pulled launch, and an unsent tap on the lost lane
    await db.events.bulkPut([
      { ...pulled[0]!, id: uuidv7(), seq: 90, body: { kind: "launch", lane: 1 } },
      { ...pulled[0]!, id: uuidv7(), seq: 91, body: { kind: "void", targetId: pulled[0]!.id } },
    ]);
    const unsent = await recordEvent(db, { runId, body: { kind: "landing", lane: 0 }, stamp: stamp() });

    await db.transaction("rw", [db.events, db.outbox], () => forgetLanes(db, [{ runId, lanes: [0] }]));
    const left = await db.events.where("runId").equals(runId).toArray();
    expect(left.map((e) => [e.body.kind, "lane" in e.body ? e.body.lane : null]).sort()).toEqual([["landing", 0], ["launch", 1]]);
    expect(left.some((e) => e.id === unsent.id)).toBe(true);
  });
});
