import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { events, runLanes } from "@/db/schema";
import type { LaneDerived } from "@/lib/sync/types";
import { db, demoUser, getPool } from "./support/db";
import { pushingAs, T0 } from "./sync-fixtures";

/** The rulings a phone records (penalty causes, attempts, mid-air; not signed; re-flight), as the server reads and applies them. */

afterAll(async () => {
  await getPool().end();
});

describe("rulings pushed by a phone", () => {
  it("applies the penalty rules on the server (F3K.4.3) and refuses malformed rulings item by item", async () => {
    const { phone, run: r, send } = pushingAs(await demoUser("ada@example.com"));
    const start = phone.at(r.id, T0, { kind: "window-start" });
    const flights = phone.flights(r.id, 0, [60, 120], T0 + 1000);
    const launch1 = flights[0]!.id;
    const good = [
      phone.at(r.id, T0 + 300_000, { kind: "penalty", lane: 0, points: 100, reason: "ground in the safety area", cause: "object-in-safety-area", launchId: launch1 }),
      phone.at(r.id, T0 + 301_000, { kind: "penalty", lane: 0, points: 300, reason: "a helper in the safety area", cause: "person-in-safety-area", launchId: launch1 }),
      phone.at(r.id, T0 + 302_000, { kind: "penalty", lane: 0, points: 100, reason: "after a collision", cause: "object-in-safety-area", launchId: flights[2]!.id, midAir: true }),
      phone.at(r.id, T0 + 303_000, { kind: "reflight", lane: 0, cause: "rain", placement: "new-group" }),
    ];
    const bad = [
      { ...phone.at(r.id, T0 + 304_000, { kind: "penalty", lane: 0, points: 100, reason: "x" }), body: { kind: "penalty", lane: 0, points: 100, reason: "x", cause: "bribery" } },
      { ...phone.at(r.id, T0 + 305_000, { kind: "unsigned", lane: 0 }), body: { kind: "unsigned", lane: 9 } },
      { ...phone.at(r.id, T0 + 306_000, { kind: "unsigned", lane: 0 }), body: { kind: "reflight", lane: 0, cause: "rain", placement: "tomorrow" } },
    ];
    const res = await send([start, ...flights, ...good, ...bad]);
    expect(res.status).toBe(200);
    for (const b of bad) expect(res.body.acks.find((a) => a.id === b.id)).toMatchObject({ status: "rejected", reason: expect.stringMatching(/^Invalid event: body/) });
    for (const g of good) expect(res.body.acks.find((a) => a.id === g.id)?.status).toBe("applied");
    const stored = await db.select({ id: events.id }).from(events).where(eq(events.runId, r.id));
    expect(stored.length).toBe(1 + flights.length + good.length);
    const [lane] = await db.select().from(runLanes).where(eq(runLanes.runId, r.id));
    // 60 + 120 s under H's ladder: 60 → 60, 120 → 120 … the result is unchanged by penalties.
    expect(lane!.resultTenths).toBe(1800);
    // Only the 300 of flight 1 counts: the 100 of the same flight and the mid-air one are dropped.
    expect((lane!.derived as LaneDerived).breakdown?.penaltyPoints).toBe(300);
  });

  it("a result not signed scores zero on the server too (F3K.1.2)", async () => {
    const { phone, run: r, send } = pushingAs(await demoUser("ada@example.com"));
    const res = await send([phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [60], T0 + 1000), phone.at(r.id, T0 + 300_000, { kind: "unsigned", lane: 0 })]);
    expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
    const [lane] = await db.select().from(runLanes).where(eq(runLanes.runId, r.id));
    expect(lane!.resultTenths).toBe(0);
    expect((lane!.derived as LaneDerived).breakdown?.parts.roundZero).toBe(600);
  });
});
