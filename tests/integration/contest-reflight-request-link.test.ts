import "./support/session";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PUT as linkRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/runs/route";
import { clubs, contestEntries, contestRounds, contests, groupSlots, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * Issue 15: a `reflight` ruling pushed before its run was linked to the pilot's slot (an officer links the lane
 * by hand later) becomes a re-flight request at the link: asked by whoever recorded it, at its corrected time;
 * a ruling undone on the phone does not; linking again adds nothing. Granting stays the officer's (F3K.9.6).
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser;
let contestId = "";
let round1 = "";
let entryId = "";
let runId = "";
const kept = { id: "" };
const undone = { id: "" };

beforeAll(async () => {
  [officer, member] = (await Promise.all(["rl-officer", "rl-member"].map((l) => freshUser(l)))) as [MockSessionUser, MockSessionUser];
  const [club] = await db.insert(clubs).values({ name: "Request Link Club", slug: `rlink-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([{ clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: member.id, role: "member" }]);
  // the contest is on the day the fixtures' runs are set up (sync-fixtures: 2025-12-29), so the officer may link them
  const day = new Date(T0).toISOString().slice(0, 10);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Request Link Cup", startsOn: day, fieldName: "Long Acre", drawSeed: 3 }).returning();
  contestId = c!.id;
  const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
  round1 = rounds[0]!.id;
  const [e] = await db.insert(contestEntries).values({ contestId, pilotName: "Dee Harrow", paper: true }).returning();
  entryId = e!.id;
  await db.insert(groupSlots).values({ roundId: round1, groupNumber: 1, entryId });
  // the member times Dee on a club session of their own (no contest duty): two rulings, the second undone on the phone
  actAs(member);
  const phone = recorder(deviceId());
  const s = session(member.id, { clubId: club!.id });
  const r = run(s.id, [{ lane: 0, pilotName: "Dee Harrow" }], getCatalogueTask("A"));
  runId = r.id;
  const first = phone.at(r.id, T0 + 5_000, { kind: "reflight", lane: 0, cause: "launch-collision", placement: "original-group", reason: "Hit on launch" });
  const second = phone.at(r.id, T0 + 7_000, { kind: "reflight", lane: 0, cause: "rain", placement: "original-group" });
  kept.id = first.id;
  undone.id = second.id;
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [
    phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [60], T0 + 1000), first, second, phone.at(r.id, T0 + 8_000, { kind: "void", targetId: second.id }),
  ] });
  expect(res.status).toBe(200);
});

const requests = async () => (await getPool().query<{ event_id: string; entry_id: string; cause: string; asked_by: string; asked_at: Date; status: string; reason: string | null }>(
  "select * from contest_reflight_requests where round_id = $1", [round1])).rows;

const link = () => linkRoute(
  new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify({ entryId, runId, lane: 0 }) }),
  { params: Promise.resolve({ contestId, roundNumber: "1" }) },
);

describe("rulings on a lane the officer links by hand", () => {
  it("no request before the link (the ruling found no slot)", async () => {
    expect(await requests()).toEqual([]);
  });

  it("the link makes the standing ruling a request (who recorded it, its corrected time); the undone one none; a second link adds nothing", async () => {
    actAs(officer);
    expect((await link()).status).toBe(200);
    expect(await requests()).toEqual([expect.objectContaining({ event_id: kept.id, entry_id: entryId, cause: "launch-collision", asked_by: member.id, status: "open", reason: "Hit on launch" })]);
    expect((await requests())[0]!.asked_at.getTime()).toBe(T0 + 5_000);
    expect((await link()).status).toBe(200);
    expect(await requests()).toHaveLength(1);
    expect((await requests()).some((r) => r.event_id === undone.id)).toBe(false);
  });
});
