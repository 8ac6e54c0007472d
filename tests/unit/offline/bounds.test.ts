import { describe, expect, it } from "vitest";
import { listPending, loadPayload } from "@/lib/offline/outbox";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { getCatalogueTask } from "@/lib/tasks";
import { freshDbsPerTest, stamp } from "./helpers";

const open = freshDbsPerTest();

describe("the device never builds a push the server must refuse whole", () => {
  it("keeps each push under the byte budget, leaving the rest queued for the next", async () => {
    const db = open();
    const s = await createSessionLocal(db, { ownerId: "u1", fieldName: "Meadow", conditions: { notes: "é".repeat(2000) }, startedAtWallMs: 1_700_000_000_000 });
    for (let i = 0; i < 30; i++) await createSessionLocal(db, { ownerId: "u1", fieldName: `Meadow ${i}`, conditions: { notes: "ü".repeat(2000) }, startedAtWallMs: 1_700_000_000_000 });
    const entries = await listPending(db, 200);
    expect(entries).toHaveLength(31);
    const { payload, sentIds } = await loadPayload(db, entries, 40_000);
    expect(sentIds.length).toBeGreaterThan(0);
    expect(sentIds.length).toBeLessThan(31);
    expect(new TextEncoder().encode(JSON.stringify(payload)).length).toBeLessThanOrEqual(40_000 + 200);
    expect(payload.sessions[0]?.id).toBe(s.id);
  });

  it("records a tap whose offset estimate is absurd without the offset, instead of losing it", async () => {
    const db = open();
    const s = await createSessionLocal(db, { ownerId: "u1", fieldName: "Meadow", conditions: {}, startedAtWallMs: 1_700_000_000_000 });
    const r = await createRunLocal(db, { sessionId: s.id, task: getCatalogueTask("A"), lanes: [{ lane: 0, pilotName: "Ada" }], createdAtWallMs: 1_700_000_000_000 });
    const bad = { ...stamp(), offset: { thetaMs: 1.7e308, deltaMs: 3_600_000, measuredAtWallMs: 1_700_000_000_000 } };
    const e = await recordEvent(db, { runId: r.id, body: { kind: "window-start" }, stamp: bad });
    expect(e.stamp.offset).toBeNull();
    expect(await db.events.get(e.id)).toBeDefined();
  });
});
