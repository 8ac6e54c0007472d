import { describe, expect, it } from "vitest";
import { discardUnstartedRun } from "@/lib/offline/discard";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { runResult } from "@/lib/results";
import { getCatalogueTask } from "@/lib/tasks";
import { freshDb, stamp } from "./helpers";

async function setUp() {
  const db = freshDb();
  const session = await createSessionLocal(db, { ownerId: "u1", fieldName: "North meadow", conditions: {}, startedAtWallMs: 1_700_000_000_000 });
  const run = await createRunLocal(db, {
    sessionId: session.id, task: getCatalogueTask("H") as unknown as Record<string, unknown>, lanes: [{ lane: 0, pilotName: "Ada" }], createdAtWallMs: 1_700_000_000_000,
  });
  return { db, session, run };
}

describe("a window set up but never started (ours)", () => {
  it("can be deleted from the phone with its session and unsent entries", async () => {
    const { db, session, run } = await setUp();
    expect(await discardUnstartedRun(db, run.id)).toBe("deleted");
    expect(await db.runs.get(run.id)).toBeUndefined();
    expect(await db.sessions.get(session.id)).toBeUndefined();
    // what was queued for the run and session is gone; only the deletion waits, for the server and other phones
    expect((await db.outbox.toArray()).map((e) => [e.id, e.kind])).toEqual([[run.id, "discard"]]);
  });

  it("a run someone else recorded (pulled, recordedBy another account) is removed here only", async () => {
    const { db, run } = await setUp();
    await db.meta.put({ key: "profile", value: { id: "u2", name: "Ben", email: "ben@example.com" } });
    await db.runs.update(run.id, { recordedBy: { id: "u1", name: "Ada" } });
    expect(await discardUnstartedRun(db, run.id)).toBe("deleted");
    expect(await db.outbox.where("kind").equals("discard").count()).toBe(0);
  });

  it("a started window is kept: its events are the record", async () => {
    const { db, run } = await setUp();
    await recordEvent(db, { runId: run.id, body: { kind: "window-start" }, stamp: stamp() });
    expect(await discardUnstartedRun(db, run.id)).toBe("started");
    expect(await db.runs.get(run.id)).toBeDefined();
  });

  it("a start that was undone leaves the window unstarted, and deletable", async () => {
    const { db, run } = await setUp();
    const start = await recordEvent(db, { runId: run.id, body: { kind: "window-start" }, stamp: stamp() });
    await recordEvent(db, { runId: run.id, body: { kind: "void", targetId: start.id }, stamp: stamp(1_700_000_001_000) });
    expect(await discardUnstartedRun(db, run.id)).toBe("deleted");
    expect(await db.events.count()).toBe(0);
  });

  it("has no result anywhere (null, not 0.0)", () => {
    const [lane] = runResult({
      task: getCatalogueTask("H"), createdBy: "u1", lanes: [{ lane: 0, pilotUserId: "u1" }], officials: new Set(), estimatesByDevice: new Map(),
      events: [{ id: "00000000-0000-7000-8000-000000000001", deviceId: "d", recordedBy: "u1", stamp: stamp(), body: { kind: "target", lane: 0, targetSec: 60 } }],
    }).lanes;
    expect(lane!.resultTenths).toBeNull();
  });
});
