import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { laneConsents, runLanes } from "@/db/schema";
import { listRecentSessions } from "@/db/queries/sessions";
import type { LaneDerived } from "@/lib/sync/types";
import { actAs, type MockSessionUser } from "./support/session";
import { db, getPool } from "./support/db";
import { decide, freshClub, pullEverything, runItem } from "./consent-fixtures";
import { pushingAs, T0 } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

/** `keeper` times `pilot` (lane 0) at a session of the keeper's: two flights and a 1,000-point penalty. */
async function timedBy(keeper: MockSessionUser, pilot: { id: string; name: string }) {
  const { phone, session: s, run: r, send } = pushingAs(keeper, [{ lane: 0, pilotName: pilot.name, pilotUserId: pilot.id }]);
  const res = await send([
    phone.at(r.id, T0, { kind: "window-start" }),
    ...phone.flights(r.id, 0, [60, 120], T0 + 1000),
    phone.at(r.id, T0 + 300_000, { kind: "penalty", lane: 0, points: 1000, reason: "Because I could" }),
  ]);
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return { sessionId: s.id, runId: r.id };
}

const recentIds = async (userId: string) => (await listRecentSessions(db, { userId, limit: 1000 })).map((s) => s.id);

describe("a run a club mate recorded for a pilot", () => {
  it("is not official, does not apply the mate's 1,000-point penalty, and is pending: not in the pilot's counted record", async () => {
    const [tobi, ada] = await freshClub(["Tobi", "Ada"]);
    const { sessionId, runId } = await timedBy(tobi!, ada!);
    const [lane] = await db.select().from(runLanes).where(eq(runLanes.runId, runId));
    const derived = lane!.derived as LaneDerived;
    expect(derived.source?.official).toBe(false);
    expect(derived.breakdown?.penaltyPoints).toBe(0);
    expect(derived.notes?.map((n) => n.points)).toEqual([1000]);
    expect(lane!.resultTenths).toBe(1800);

    const pulled = runItem(await pullEverything(ada!.id), runId);
    expect(pulled?.recordedBy).toEqual({ id: tobi!.id, name: "Tobi" });
    expect(pulled?.consents).toEqual([{ lane: 0, status: "pending", reason: null }]);
    expect(pulled?.results?.[0]).toMatchObject({ penaltyPoints: 0, notes: [expect.objectContaining({ kind: "penalty", points: 1000 })] });
    expect(await recentIds(ada!.id)).not.toContain(sessionId);
  });

  it("counts once the pilot accepts it; a dispute's reason reaches the recorder; hiding keeps it on the server and with the recorder", async () => {
    const [tobi, ada] = await freshClub(["Tobi", "Ada"]);
    const first = await timedBy(tobi!, ada!);
    const second = await timedBy(tobi!, ada!);
    const third = await timedBy(tobi!, ada!);
    actAs(ada!);
    expect((await decide(first.runId, 0, { decision: "accepted" })).body).toEqual({ consent: { lane: 0, status: "accepted", reason: null } });
    expect(await recentIds(ada!.id)).toContain(first.sessionId);
    expect((await decide(second.runId, 0, { decision: "disputed", reason: "I flew 90 s on the second flight" })).status).toBe(200);
    expect((await decide(third.runId, 0, { decision: "hidden" })).status).toBe(200);
    const recent = await recentIds(ada!.id);
    expect(recent).not.toContain(second.sessionId);
    expect(recent).not.toContain(third.sessionId);

    const tobiSees = await pullEverything(tobi!.id);
    expect(runItem(tobiSees, second.runId)?.consents).toEqual([{ lane: 0, status: "disputed", reason: "I flew 90 s on the second flight" }]);
    expect(runItem(tobiSees, third.runId)?.consents).toEqual([{ lane: 0, status: "hidden", reason: null }]);
    expect(await recentIds(tobi!.id)).toContain(third.sessionId);
    expect(runItem(await pullEverything(ada!.id), third.runId)?.consents?.[0]?.status).toBe("hidden");
  });

  it("a hidden run can be un-hidden: 'pending' takes the decision back, on the server and in every pull", async () => {
    const [tobi, ada] = await freshClub(["Tobi", "Ada"]);
    const { runId } = await timedBy(tobi!, ada!);
    actAs(ada!);
    expect((await decide(runId, 0, { decision: "hidden" })).status).toBe(200);
    expect(await db.select().from(laneConsents).where(eq(laneConsents.runId, runId))).toHaveLength(1);
    expect((await decide(runId, 0, { decision: "pending" })).body).toEqual({ consent: { lane: 0, status: "pending", reason: null } });
    expect(await db.select().from(laneConsents).where(eq(laneConsents.runId, runId))).toEqual([]);
    expect(runItem(await pullEverything(ada!.id), runId)?.consents).toEqual([{ lane: 0, status: "pending", reason: null }]);
    expect(runItem(await pullEverything(tobi!.id), runId)?.consents).toEqual([{ lane: 0, status: "pending", reason: null }]);
    // the recorder cannot take it back for her
    actAs(tobi!);
    expect((await decide(runId, 0, { decision: "pending" })).status).toBe(404);
  });

  it("only that lane's pilot may decide: 401 signed out, 404 for the recorder and anyone else, 409 for a run of one's own, 422 for a dispute without a reason", async () => {
    const [tobi, ada, lena] = await freshClub(["Tobi", "Ada", "Lena"]);
    const { runId } = await timedBy(tobi!, ada!);
    const own = await timedBy(ada!, ada!);
    actAs(null);
    expect((await decide(runId, 0, { decision: "accepted" })).status).toBe(401);
    actAs(tobi!);
    expect((await decide(runId, 0, { decision: "accepted" })).status).toBe(404);
    actAs(lena!);
    expect((await decide(runId, 0, { decision: "accepted" })).status).toBe(404);
    actAs(ada!);
    expect((await decide(runId, 1, { decision: "accepted" })).status).toBe(404);
    expect((await decide("not-a-uuid", 0, { decision: "accepted" })).status).toBe(404);
    expect((await decide(own.runId, 0, { decision: "accepted" })).body.error.code).toBe("own_record");
    expect((await decide(runId, 0, { decision: "disputed" })).status).toBe(422);
    expect((await decide(runId, 0, { decision: "disputed", reason: "x".repeat(281) })).status).toBe(422);
    expect((await decide(runId, 0, { decision: "maybe" })).status).toBe(422);
    expect(await db.select().from(laneConsents).where(eq(laneConsents.runId, runId))).toEqual([]);
  });
});
