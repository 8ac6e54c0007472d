import { v7 as uuidv7 } from "uuid";
import { describe, expect, it } from "vitest";
import { createWindowcallDb, getMeta } from "@/lib/offline/db";
import { getDeviceId } from "@/lib/offline/device";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { freshDbsPerTest, stamp } from "./helpers";

const open = freshDbsPerTest();

const runId = uuidv7();

describe("recordEvent", () => {
  it("writes the event and its outbox entry together", async () => {
    const db = open();
    const ev = await recordEvent(db, { runId, body: { kind: "launch", lane: 0 }, stamp: stamp() }, { now: () => 42 });
    expect(await db.events.get(ev.id)).toEqual(ev);
    expect(await db.outbox.get(ev.id)).toEqual({ id: ev.id, kind: "event", createdAt: 42, queueSeq: 1, attempts: 0 });
    expect(ev).toMatchObject({ runId, seq: 1, deviceId: await getDeviceId(db) });
  });

  it("a transaction that fails after the event was added leaves neither event nor outbox entry", async () => {
    const db = open();
    db.outbox.hook("creating", () => {
      throw new Error("disk full");
    });
    await expect(recordEvent(db, { runId, body: { kind: "landing", lane: 1 }, stamp: stamp() })).rejects.toThrow(/disk full/);
    expect(await db.events.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
    expect(await getMeta(db, "nextSeq")).toBeUndefined(); // the seq taken inside was rolled back too
  });

  it("bad input throws and changes nothing", async () => {
    const db = open();
    // lane 7 does not exist (lanes are 0–3)
    await expect(recordEvent(db, { runId, body: { kind: "launch", lane: 7 }, stamp: stamp() })).rejects.toThrow();
    await expect(recordEvent(db, { runId: "not-a-uuid", body: { kind: "window-start" }, stamp: stamp() })).rejects.toThrow();
    expect(await db.events.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
  });

  it("gives unique, gap-free seqs to concurrent calls, even from two tabs on one database", async () => {
    const name = `test-${uuidv7()}`;
    const tabA = open(createWindowcallDb(name));
    const tabB = open(createWindowcallDb(name));
    const writes = Array.from({ length: 60 }, (_, i) =>
      recordEvent(i % 2 ? tabA : tabB, { runId, body: { kind: "launch", lane: 0 }, stamp: stamp() }),
    );
    const events = await Promise.all(writes);
    const seqs = events.map((e) => e.seq).sort((a, b) => a - b);
    expect(seqs).toEqual(Array.from({ length: 60 }, (_, i) => i + 1));
    expect(new Set(events.map((e) => e.deviceId)).size).toBe(1);
    // the per-device index keeps them in recorded order
    const bySeq = await tabA.events.where("[deviceId+seq]").between([events[0]!.deviceId, 0], [events[0]!.deviceId, Infinity]).toArray();
    expect(bySeq.map((e) => e.seq)).toEqual(seqs);
  });
});

describe("createSessionLocal / createRunLocal", () => {
  it("writes each entity with its outbox entry, queued in order", async () => {
    const db = open();
    const session = await createSessionLocal(db, { ownerId: "u1", fieldName: "North strip", conditions: { windMs: 3 }, startedAtWallMs: 1 });
    const run = await createRunLocal(db, { sessionId: session.id, task: { code: "A" }, lanes: [{ lane: 0, pilotName: "Pilot One" }], createdAtWallMs: 2 });
    expect(await db.sessions.get(session.id)).toEqual(session);
    expect(await db.runs.get(run.id)).toEqual(run);
    const queue = await db.outbox.orderBy("queueSeq").toArray();
    expect(queue.map((e) => [e.kind, e.id])).toEqual([["session", session.id], ["run", run.id]]);
  });

  it("refuses a run with a repeated lane, writing nothing", async () => {
    const db = open();
    const lanes = [{ lane: 0, pilotName: "A" }, { lane: 0, pilotName: "B" }];
    await expect(createRunLocal(db, { sessionId: uuidv7(), task: {}, lanes, createdAtWallMs: 1 })).rejects.toThrow(/unique/);
    expect(await db.runs.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
  });
});

describe("getDeviceId", () => {
  it("is generated once and stable, even when two tabs ask at once", async () => {
    const name = `test-${uuidv7()}`;
    const [a, b] = await Promise.all([getDeviceId(open(createWindowcallDb(name))), getDeviceId(open(createWindowcallDb(name)))]);
    expect(a).toBe(b);
    expect(await getDeviceId(open(createWindowcallDb(name)))).toBe(a);
  });
});
