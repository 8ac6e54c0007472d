import "./support/session";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PUT as recordsRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/records/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { listPendingRecords } from "@/db/queries/contest-records";
import { clubs, contestEntries, contestRounds, contests, groupSlots, memberships, slotRecords } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * Issue 15: two records for one pilot and round that disagree are both kept and shown side by side
 * for the officer's decision: a timekeeper's phone run that replaces a paper card, a second run from
 * the same timekeeper. The decision sets the slot (the one result path: the paper card through the
 * task engine, or run_lanes.result_tenths) and is kept with who and when. Task A (last flight).
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser, keeper: MockSessionUser;
let contestId = "";
let round1 = "";
let ada = "";

beforeAll(async () => {
  [officer, member, keeper] = (await Promise.all(["rec-officer", "rec-member", "rec-keeper"].map((l) => freshUser(l)))) as [MockSessionUser, MockSessionUser, MockSessionUser];
  const [club] = await db.insert(clubs).values({ name: "Records Club", slug: `records-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: member.id, role: "member" }, { clubId: club!.id, userId: keeper.id, role: "member" },
  ]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Two Cards Cup", startsOn: new Date().toISOString().slice(0, 10), fieldName: "Wide Field", drawSeed: 2 }).returning();
  contestId = c!.id;
  const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
  round1 = rounds[0]!.id;
  const [e] = await db.insert(contestEntries).values({ contestId, pilotName: "Ada Fenn", paper: true }).returning();
  ada = e!.id;
  // the officer entered Ada's paper card (150.0 s, signed); her timekeeper's phone also timed her
  await db.insert(groupSlots).values({
    roundId: round1, groupNumber: 1, entryId: ada, paperFlights: [1500], signedAt: new Date(T0), signedFrom: "paper card",
    recordedBy: officer.id, recordedAt: new Date(T0), timekeeperUserId: keeper.id,
  });
});

/** The keeper's phone times Ada's lane once for `secs` seconds and pushes it; returns the run id. */
async function phoneRun(secs: number): Promise<string> {
  actAs(keeper);
  const phone = recorder(deviceId());
  const s = session(keeper.id);
  const r = { ...run(s.id, [{ lane: 0, pilotName: "Ada Fenn" }], getCatalogueTask("A")), contest: { roundId: round1, slots: [{ lane: 0, entryId: ada }] } };
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [secs], T0 + 1000)] });
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return r.id;
}
const slot = async () => (await db.select().from(groupSlots).where(and(eq(groupSlots.roundId, round1), eq(groupSlots.entryId, ada))))[0]!;
const decide = (body: unknown) => recordsRoute(
  new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
  { params: Promise.resolve({ contestId, roundNumber: "1" }) },
);
async function adaResult(): Promise<number | null> {
  actAs(member);
  const res = await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) });
  return ((await res.json()) as { standings: { pilots: { rounds: { resultTenths: number | null }[] }[] } }).standings.pilots[0]!.rounds[0]!.resultTenths;
}

describe("two records for one pilot and round", () => {
  it("a phone run over a paper card, then a second run: every replaced record is kept, shown beside the counting one", async () => {
    const first = await phoneRun(120);
    expect(await slot()).toMatchObject({ runId: first, paperFlights: null });
    const second = await phoneRun(130);
    expect(await slot()).toMatchObject({ runId: second });
    const [row] = await listPendingRecords(db, round1);
    expect(row).toMatchObject({ name: "Ada Fenn", runId: second, runResultTenths: 1300 });
    // kept in order: the paper card (150.0 s, with its signature), then the first run (120.0 s)
    expect(row!.others.map((o) => [o.paperFlights, o.runId, o.runResultTenths, o.signedFrom])).toEqual([[[1500], null, null, "paper card"], [null, first, 1200, null]]);
    expect(await adaResult()).toBe(1300);
  });

  it("only an officer decides; an unknown record is refused and changes nothing", async () => {
    actAs(member);
    expect((await decide({ entryId: ada, recordId: null })).status).toBe(403);
    actAs(officer);
    // a record that is not one of the waiting ones: a stale page, a conflict with the stored state (as for a re-flight's records)
    const stale = await decide({ entryId: ada, recordId: randomUUID() });
    expect(stale.status).toBe(409);
    expect(((await stale.json()) as { error: { code: string } }).error.code).toBe("decided");
    expect((await decide({ entryId: randomUUID(), recordId: null })).status).toBe(422);
    expect((await listPendingRecords(db, round1))[0]!.others).toHaveLength(2);
  });

  it("the officer counts the paper card: the slot takes it with its signature, the run it replaces is kept, who and when recorded", async () => {
    const [row] = await listPendingRecords(db, round1);
    const card = row!.others.find((o) => o.paperFlights !== null)!;
    actAs(officer);
    expect((await decide({ entryId: ada, recordId: card.id })).status).toBe(200);
    expect(await slot()).toMatchObject({ paperFlights: [1500], runId: null, signedFrom: "paper card" });
    // task A counts the last flight: 150.0 s (the one result path: the card through the task engine)
    expect(await adaResult()).toBe(1500);
    expect(await listPendingRecords(db, round1)).toEqual([]);
    const kept = await db.select().from(slotRecords).innerJoin(groupSlots, eq(groupSlots.id, slotRecords.slotId)).where(eq(groupSlots.entryId, ada));
    expect(kept.map((k) => k.slot_records.outcome).sort()).toEqual(["counted", "set-aside", "set-aside"]);
    for (const k of kept) expect(k.slot_records).toMatchObject({ decidedBy: officer.id, decidedAt: expect.any(Date) });
  });
});
