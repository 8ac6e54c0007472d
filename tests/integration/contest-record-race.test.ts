import "./support/session";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { Client } from "pg";
import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { listPendingRecords } from "@/db/queries/contest-records";
import { saveGroupCards } from "@/db/queries/contest-results";
import { clubs, contestEntries, contestRounds, contests, groupSlots, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { settledOrWaiting } from "./support/day-locks";
import { db, freshUser, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * Issue 15's kept records under concurrency: when a phone's run and an officer's paper card reach one slot at
 * the same time, the one written second must keep the first for the officer's decision. Each writer locks the
 * slot before copying what it replaces, so it copies what the other committed, not what its snapshot saw.
 * The other writer's transaction is held open on a second connection (as a concurrent request would hold it).
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, keeper: MockSessionUser;
let roundId = "";
let ada = "";

beforeEach(async () => {
  [officer, keeper] = (await Promise.all(["race-officer", "race-keeper"].map((l) => freshUser(l)))) as [MockSessionUser, MockSessionUser];
  const [club] = await db.insert(clubs).values({ name: "Race Club", slug: `race-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([{ clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: keeper.id, role: "member" }]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Same Slot Cup", startsOn: new Date().toISOString().slice(0, 10), fieldName: "Long Field", drawSeed: 3 }).returning();
  const [r] = await db.insert(contestRounds).values({ contestId: c!.id, number: 1, task: getCatalogueTask("A") }).returning();
  roundId = r!.id;
  const [e] = await db.insert(contestEntries).values({ contestId: c!.id, pilotName: "Ada Fenn", paper: true }).returning();
  ada = e!.id;
  await db.insert(groupSlots).values({ roundId, groupNumber: 1, entryId: ada, timekeeperUserId: keeper.id });
});

/** The keeper's phone times Ada's lane for `secs` seconds; `linked` says whether the run names her slot. */
async function phoneRun(secs: number, linked: boolean): Promise<string> {
  actAs(keeper);
  const phone = recorder(deviceId());
  const s = session(keeper.id);
  const plain = run(s.id, [{ lane: 0, pilotName: "Ada Fenn" }], getCatalogueTask("A"));
  const r = linked ? { ...plain, contest: { roundId, slots: [{ lane: 0, entryId: ada }] } } : plain;
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [secs], T0 + 1000)] });
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return r.id;
}

/** Runs `write` on a second connection inside a transaction that stays open until the returned commit is called. */
async function heldOpen(write: string, values: unknown[]): Promise<{ commit: () => Promise<void> }> {
  const other = new Client({ connectionString: process.env.DATABASE_URL });
  await other.connect();
  await other.query("begin");
  await other.query(write, values);
  return { commit: async () => { await other.query("commit"); await other.end(); } };
}

const slot = async () => (await db.select().from(groupSlots).where(and(eq(groupSlots.roundId, roundId), eq(groupSlots.entryId, ada))))[0]!;

describe("one slot written by a phone and an officer at once", () => {
  it("a card saved while the phone's run is linked: the run counts and the card is kept for the decision", async () => {
    const card = await heldOpen(
      "update group_slots set paper_flights = '[1500]', recorded_by = $1, recorded_at = now() where round_id = $2 and entry_id = $3",
      [officer.id, roundId, ada],
    );
    const linking = phoneRun(120, true);
    expect(await settledOrWaiting(linking, "group_slots")).toBe("waiting"); // for the card's transaction
    await card.commit();
    const runId = await linking;
    expect(await slot()).toMatchObject({ runId, paperFlights: null });
    const [row] = await listPendingRecords(db, roundId);
    // before the slot was locked first, the push copied the empty slot its snapshot saw and the card was lost
    expect(row?.others.map((o) => [o.paperFlights, o.runId])).toEqual([[[1500], null]]);
  });

  it("a phone's run linked while a card is saved: the card counts and the run is kept for the decision", async () => {
    const runId = await phoneRun(120, false);
    const linkedRun = await heldOpen(
      "update group_slots set run_id = $1, lane = 0, paper_flights = null, recorded_by = $2, recorded_at = now() where round_id = $3 and entry_id = $4",
      [runId, keeper.id, roundId, ada],
    );
    const saving = saveGroupCards(db, { roundId, groupNumber: 1, userId: officer.id, cards: [{ entryId: ada, flights: [1500], penaltyPoints: 0, signed: true }] });
    expect(await settledOrWaiting(saving, "group_slots")).toBe("waiting");
    await linkedRun.commit();
    expect(await saving).toBe("saved");
    expect(await slot()).toMatchObject({ paperFlights: [1500] });
    const [row] = await listPendingRecords(db, roundId);
    expect(row?.others.map((o) => [o.paperFlights, o.runId, o.runResultTenths])).toEqual([[null, runId, 1200]]);
  });
});
