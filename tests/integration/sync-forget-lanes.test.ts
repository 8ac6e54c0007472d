import "./support/session";
import "fake-indexeddb/auto";
import { and, eq, sql } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { afterAll, describe, expect, it } from "vitest";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { listChanges } from "@/db/queries/sync-pull";
import { coachGrants } from "@/db/schema";
import { createWindowcallDb } from "@/lib/offline/db";
import { pullAll } from "@/lib/offline/pull";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { decide, freshClub, grant, runItem } from "./consent-fixtures";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

type U = { id: string; email: string; name: string; role: "member" | "admin" };

/** Tobi times one run for Ada (lane 0) and Bea (lane 1), one flight each; both accept it. */
async function sharedRun(tobi: U, ada: U, bea: U): Promise<string> {
  actAs(tobi);
  const phone = recorder(deviceId());
  const s = session(tobi.id);
  const r = run(s.id, [{ lane: 0, pilotName: ada.name, pilotUserId: ada.id }, { lane: 1, pilotName: bea.name, pilotUserId: bea.id }]);
  const res = await push({
    deviceId: phone.id, sessions: [s], runs: [r],
    events: [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [60], T0 + 1000), ...phone.flights(r.id, 1, [45], T0 + 2000)],
  });
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  for (const pilot of [ada, bea]) {
    actAs(pilot);
    expect((await decide(r.id, pilot === ada ? 0 : 1, { decision: "accepted" })).status).toBe(200);
  }
  return r.id;
}

/** A coach's phone: its own device database, pulling through the real route as `coach`. */
function coachPhone(coach: U) {
  const phone = createWindowcallDb(`coach-${uuidv7()}`);
  const sync = () =>
    pullAll({
      db: phone,
      account: coach.id,
      fetch: async (url: string) => {
        actAs(coach);
        return pullRoute(new Request(`http://test${url}`));
      },
    });
  const lanesHeld = async (runId: string) => new Set((await phone.events.where("runId").equals(runId).toArray()).flatMap((e) => ("lane" in e.body ? [e.body.lane] : [])));
  return { phone, sync, lanesHeld };
}

/** Ada and Bea both grant the coach; the coach's phone has pulled the run with both their lanes. */
async function coachHoldsSharedRun() {
  const [tobi, ada, bea, coach] = (await freshClub(["Tobi", "Ada", "Bea", "Coach"])) as [U, U, U, U];
  await grant(ada, coach);
  await grant(bea, coach);
  const runId = await sharedRun(tobi, ada, bea);
  const phone = coachPhone(coach);
  expect((await phone.sync()).kind).toBe("ok");
  expect(await phone.lanesHeld(runId)).toEqual(new Set([0, 1]));
  return { ada, coach, runId, ...phone };
}

describe("a lane lost from a run a coach still sees reaches the coach's phone as a forget item", () => {
  it("a pilot hides her lane: the phone drops that lane's events and keeps the other pilot's", async () => {
    const { ada, coach, runId, phone, sync, lanesHeld } = await coachHoldsSharedRun();
    expect((await listChanges(db, { userId: coach.id, cursor: "0" })).forgetLanes).toBeUndefined();

    actAs(ada);
    expect((await decide(runId, 0, { decision: "hidden" })).status).toBe(200);
    // the run stays visible through Bea's lane: not a run to forget, a lane
    const first = await listChanges(db, { userId: coach.id, cursor: "0" });
    expect(first.forget ?? []).not.toContain(runId);
    expect(first.forgetLanes).toEqual([{ runId, lanes: [0] }]);
    expect(runItem(first.items, runId)?.data.lanes.map((l) => l.lane)).toEqual([1]);

    expect((await sync()).kind).toBe("ok");
    expect(await lanesHeld(runId)).toEqual(new Set([1]));
    expect((await phone.runs.get(runId))?.lanes.map((l) => l.lane)).toEqual([1]);
    phone.close();
  });

  it("a pilot revokes her grant while another pilot's lane keeps the run in sight: her lane goes", async () => {
    const { ada, coach, runId, phone, sync, lanesHeld } = await coachHoldsSharedRun();

    await db.update(coachGrants).set({ revokedAt: sql`now()` }).where(and(eq(coachGrants.pilotId, ada.id), eq(coachGrants.coachId, coach.id)));
    expect((await sync()).kind).toBe("ok");
    expect(await lanesHeld(runId)).toEqual(new Set([1]));
    expect(await phone.runs.get(runId)).toBeDefined();
    phone.close();
  });
});
