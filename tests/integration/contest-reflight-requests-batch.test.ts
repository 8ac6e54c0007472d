import "./support/session";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { clubs, contestEntries, contestRounds, contests, groupSlots, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * The phone's `reflight` rulings of one push become requests in one statement (recordReflightRequests): each
 * ruling on a lane linked to the pushing timekeeper's slot is a request for that slot's pilot, with its own
 * cause and time; a ruling on a lane linked to nothing is none; a repeat adds none.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let keeper: MockSessionUser;
let round1 = "";
const ids: Record<string, string> = {};

beforeAll(async () => {
  keeper = await freshUser("rb-keeper");
  const [club] = await db.insert(clubs).values({ name: "Batch Club", slug: `batch-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values({ clubId: club!.id, userId: keeper.id, role: "member" });
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Batch Cup", startsOn: new Date().toISOString().slice(0, 10), fieldName: "Long Acre", drawSeed: 2 }).returning();
  const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId: c!.id, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
  round1 = rounds[0]!.id;
  const entries = await db.insert(contestEntries).values(["Ria Moss", "Sam Tern", "Tia Vole"].map((pilotName) => ({ contestId: c!.id, pilotName, paper: true }))).returning();
  for (const e of entries) ids[e.pilotName] = e.id;
  // the keeper times Ria and Sam; Tia's slot has no timekeeper
  await db.insert(groupSlots).values(entries.map((e) => ({ roundId: round1, groupNumber: 1, entryId: e.id, timekeeperUserId: e.pilotName === "Tia Vole" ? null : keeper.id })));
});

describe("recordReflightRequests", () => {
  it("two rulings in one push: a request each with its cause and time; one on a lane of nobody's slot: none; sent again: none", async () => {
    actAs(keeper);
    const phone = recorder(deviceId());
    const s = session(keeper.id);
    const r = { ...run(s.id, [{ lane: 0, pilotName: "Ria Moss" }, { lane: 1, pilotName: "Sam Tern" }, { lane: 2, pilotName: "Tia Vole" }], getCatalogueTask("A")),
      contest: { roundId: round1, slots: [{ lane: 0, entryId: ids["Ria Moss"]! }, { lane: 1, entryId: ids["Sam Tern"]! }, { lane: 2, entryId: ids["Tia Vole"]! }] } };
    const body = { deviceId: phone.id, sessions: [s], runs: [r], events: [
      phone.at(r.id, T0, { kind: "window-start" }),
      phone.at(r.id, T0 + 5_000, { kind: "reflight", lane: 0, cause: "launch-collision", placement: "later-group", reason: "Hit on launch" }),
      phone.at(r.id, T0 + 7_000, { kind: "reflight", lane: 1, cause: "rain", placement: "original-group" }),
      phone.at(r.id, T0 + 9_000, { kind: "reflight", lane: 2, cause: "organiser", placement: "new-group" }),
    ] };
    expect((await push(body)).status).toBe(200);
    const rows = async () => (await getPool().query<{ entry_id: string; cause: string; placement: string; reason: string | null; asked_at: Date }>(
      "select entry_id, cause, placement, reason, asked_at from contest_reflight_requests where round_id = $1 order by asked_at", [round1])).rows;
    expect((await rows()).map((q) => [q.entry_id, q.cause, q.placement, q.reason, q.asked_at.getTime()])).toEqual([
      [ids["Ria Moss"], "launch-collision", "later-group", "Hit on launch", T0 + 5_000],
      [ids["Sam Tern"], "rain", "original-group", null, T0 + 7_000],
    ]);
    await push(body);
    expect(await rows()).toHaveLength(2);
  });
});
