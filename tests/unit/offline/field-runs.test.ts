import { describe, expect, it } from "vitest";
import { FieldRunsReader, RECENT_SHOWN } from "@/lib/offline/field-runs";
import { setMeta } from "@/lib/offline/db";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { phoneRunResult } from "@/lib/offline/run-result";
import { getCatalogueTask } from "@/lib/tasks";
import { freshDbsPerTest, stamp } from "./helpers";

const open = freshDbsPerTest();
const task = getCatalogueTask("A");

/** A phone holding `finished` finished windows (flight n lasts 60 + n s), one open and one set up but never started. */
async function phone(finished: number) {
  const db = open();
  await setMeta(db, "profile", { id: "me", name: "Ada", email: "ada@example.com" });
  const session = await createSessionLocal(db, { ownerId: "me", fieldName: "Low Meadow", conditions: {}, startedAtWallMs: 1 });
  const ids: string[] = [];
  for (let n = 0; n < finished; n++) {
    const t0 = 1_700_000_000_000 + n * 1_000_000;
    const run = await createRunLocal(db, { sessionId: session.id, task: task as unknown as Record<string, unknown>, lanes: [{ lane: 0, pilotName: "Ada", pilotUserId: "me" }], createdAtWallMs: t0 });
    for (const [dt, body] of [[0, { kind: "window-start" }], [1_000, { kind: "launch", lane: 0 }], [61_000 + n * 1_000, { kind: "landing", lane: 0 }], [600_000, { kind: "run-end" }]] as const) {
      await recordEvent(db, { runId: run.id, body, stamp: { ...stamp(t0 + dt), monoMs: dt } });
    }
    ids.push(run.id);
  }
  const late = 1_800_000_000_000;
  const openRun = await createRunLocal(db, { sessionId: session.id, task: task as unknown as Record<string, unknown>, lanes: [{ lane: 0, pilotName: "Ada" }], createdAtWallMs: late });
  await recordEvent(db, { runId: openRun.id, body: { kind: "window-start" }, stamp: stamp(late) });
  const unstarted = await createRunLocal(db, { sessionId: session.id, task: task as unknown as Record<string, unknown>, lanes: [{ lane: 0, pilotName: "Ada" }], createdAtWallMs: late + 1 });
  await recordEvent(db, { runId: unstarted.id, body: { kind: "run-end" }, stamp: stamp(late + 2) });
  return { db, session, ids: ids.reverse(), openRun };
}

describe("FieldRunsReader (/field's open windows and recent results)", () => {
  it("lists the open window and the newest finished ones, each scored by the one result function", async () => {
    const { db, session, ids, openRun } = await phone(RECENT_SHOWN + 3);
    const runs = await new FieldRunsReader().read(db);
    expect(runs.open.map((r) => r.run.id)).toEqual([openRun.id]);
    expect(runs.open[0]!.resultsTenths).toEqual([]);
    // never-started window left out; newest first; only as many as the list shows
    expect(runs.recent.map((r) => r.run.id)).toEqual(ids.slice(0, RECENT_SHOWN));
    for (const row of runs.recent) {
      expect(row.session?.id).toBe(session.id);
      expect(row.task?.letter).toBe("A");
      const events = await db.events.where("runId").equals(row.run.id).toArray();
      expect(row.resultsTenths).toEqual(phoneRunResult(row.run, task, events, { deviceId: null, me: "me", estimate: null }).lanes.map((l) => l.resultTenths));
    }
    // the newest finished flight lasted 60 + 12 s: task A counts the last flight, up to 300 s (F3K.11, task A; F3K.7)
    expect(runs.recent[0]!.resultsTenths).toEqual([720]);
  });

  it("a re-read sees a run's new events (re-scored) and a changed task", async () => {
    const { db, ids } = await phone(2);
    const reader = new FieldRunsReader();
    expect((await reader.read(db)).recent.map((r) => r.resultsTenths)).toEqual([[610], [600]]);
    // the newest run's flight marked invalid (keyed by its launch's id): it no longer scores
    const launch = (await db.events.where("runId").equals(ids[0]!).toArray()).find((e) => e.body.kind === "launch")!;
    await recordEvent(db, { runId: ids[0]!, body: { kind: "invalid", lane: 0, flightId: launch.id, reason: "landing-outside-field" }, stamp: stamp(1_700_000_000_000 + 1_000_000 + 700_000) });
    await db.runs.update(ids[1]!, { task: getCatalogueTask("B") as unknown as Record<string, unknown> });
    const again = await reader.read(db);
    expect(again.recent[0]!.resultsTenths).toEqual([0]);
    expect(again.recent[1]!.task?.letter).toBe("B");
  });
});
