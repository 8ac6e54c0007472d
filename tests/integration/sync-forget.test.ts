import "./support/session";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { coachGrants } from "@/db/schema";
import { listChanges } from "@/db/queries/sync-pull";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { decide, freshClub, grant, pullEverything, runItem } from "./consent-fixtures";
import { deviceId, pull, push, recorder, run, session, T0 } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

type U = { id: string; email: string; name: string; role: "member" | "admin" };

/** `user` records a run with `pilot` in lane 0 (one flight) and returns its id. */
async function recordRunFor(user: U, pilot: U, createdAtWallMs?: number): Promise<string> {
  actAs(user);
  const phone = recorder(deviceId());
  const s = session(user.id);
  const r = { ...run(s.id, [{ lane: 0, pilotName: pilot.name, pilotUserId: pilot.id }]), ...(createdAtWallMs ? { createdAtWallMs } : {}) };
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [60], T0 + 1000)] });
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return r.id;
}

const forgetFrom = async (userId: string, cursor = "0") => (await listChanges(db, { userId, cursor })).forget ?? [];

describe("a pull tells a coach's phone what to forget", () => {
  it("names a run once the pilot hides its lane, and every counted run once the grant is revoked — ids only, nothing else", async () => {
    const [tobi, ada, coach] = await freshClub(["Tobi", "Ada", "Coach"]);
    await grant(ada!, coach!);
    const own = await recordRunFor(ada!, ada!); // Ada's own record: the coach sees it
    const byTobi = await recordRunFor(tobi!, ada!); // recorded for Ada: seen once she accepts
    const pending = await recordRunFor(tobi!, ada!); // never decided: the coach never saw it
    const coachesOwn = await recordRunFor(coach!, coach!);
    actAs(ada!);
    expect((await decide(byTobi, 0, { decision: "accepted" })).status).toBe(200);
    const seen = await pullEverything(coach!.id);
    expect(runItem(seen, own)).toBeDefined();
    expect(runItem(seen, byTobi)).toBeDefined();
    expect(await forgetFrom(coach!.id)).toEqual([]);

    // Ada hides the run Tobi recorded for her: the coach's scope changes and a pull from the start names it
    const before = await listChanges(db, { userId: coach!.id, cursor: "0" });
    expect((await decide(byTobi, 0, { decision: "hidden" })).status).toBe(200);
    const after = await listChanges(db, { userId: coach!.id, cursor: "0", limit: 1 });
    expect(after.scope).not.toBe(before.scope);
    expect(after.forget).toEqual([byTobi]);
    expect(runItem(await pullEverything(coach!.id), byTobi)).toBeUndefined();
    // only on a pull from the start (which a changed scope leads to), never on a later page
    expect(await forgetFrom(coach!.id, after.nextCursor)).toEqual([]);

    // Ada revokes the grant: both runs the coach may hold go; the pending one and the coach's own never appear
    await db.update(coachGrants).set({ revokedAt: sql`now()` }).where(and(eq(coachGrants.pilotId, ada!.id), eq(coachGrants.coachId, coach!.id)));
    const later = await recordRunFor(ada!, ada!, Date.now() + 3_600_000); // after the revocation
    const forget = await forgetFrom(coach!.id);
    expect(new Set(forget)).toEqual(new Set([own, byTobi]));
    for (const id of [pending, coachesOwn, later]) expect(forget).not.toContain(id);
    const items = await pullEverything(coach!.id);
    expect(items.some((i) => i.type === "run" && i.data.lanes.some((l) => l.pilotUserId === ada!.id))).toBe(false);
    expect(runItem(items, coachesOwn)).toBeDefined();

    // through the route: ids only
    actAs(coach!);
    const res = await pull("0");
    expect(res.status).toBe(200);
    expect(new Set(res.body.forget)).toEqual(new Set([own, byTobi]));

    // granted again: the runs are visible again and no longer named
    await grant(ada!, coach!);
    expect(await forgetFrom(coach!.id)).toEqual([byTobi]); // still hidden by Ada
    expect(runItem(await pullEverything(coach!.id), own)).toBeDefined();
  });
});
