import "./support/session";
import { randomBytes, randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DELETE as removeRoute, POST as giveRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/penalties/route";
import { POST as lodgeRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/disputes/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { GET as publicRoute } from "@/app/api/public-results/[token]/route";
import { clubs, contestDisputes, contestEntries, contestPenalties, contestRounds, contests, groupSlots, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * Issue 15, penalties recorded by officers one by one: an officer gives a pilot a penalty on the round
 * page (cause, points, note; who and when kept), removes it (kept, marked with who, when and why); the
 * standings count what is not removed, a launch contact zeroes the round (F3K.4.1); a penalty the
 * timekeeper's phone already gave cannot be typed again (no double count). The penalties CSV lists each
 * one with who and when. And a dispute's lodged time, entered by the officer.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser, keeper: MockSessionUser, stranger: MockSessionUser;
let contestId = "";
let round1 = "";
const token = randomBytes(32).toString("base64url");
const ids: Record<string, string> = {};
const today = new Date().toISOString().slice(0, 10);

beforeAll(async () => {
  [officer, member, keeper, stranger] = (await Promise.all(["pn-officer", "pn-member", "pn-keeper", "pn-stranger"].map((l) => freshUser(l)))) as [
    MockSessionUser, MockSessionUser, MockSessionUser, MockSessionUser,
  ];
  const [club] = await db.insert(clubs).values({ name: "Penalty Club", slug: `penalty-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: member.id, role: "member" }, { clubId: club!.id, userId: keeper.id, role: "member" },
  ]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Penalty Cup", startsOn: today, fieldName: "Long Acre", drawSeed: 4, publicToken: token }).returning();
  contestId = c!.id;
  const rounds = await db.insert(contestRounds).values([
    ...["A", "B", "D", "F", "G"].map((l, i) => ({ contestId, number: i + 1, task: getCatalogueTask(l as "A") })),
    { contestId, number: 1, isFlyOff: true, task: getCatalogueTask("A") },
  ]).returning();
  round1 = rounds[0]!.id;
  const entries = await db.insert(contestEntries).values(["Ula Brent", "Vic Sallow", "Wyn Carrow"].map((pilotName) => ({ contestId, pilotName, paper: true }))).returning();
  for (const e of entries) ids[e.pilotName] = e.id;
  // round 1, task A: Ula's card 150.0 s, Vic's 200.0 s, both signed; Wyn is timed on the keeper's phone; all three in fly-off round 1
  const card = (name: string, tenths: number) => ({ roundId: round1, groupNumber: 1, entryId: ids[name]!, paperFlights: [tenths], signedAt: new Date(), signedFrom: "paper card" });
  await db.insert(groupSlots).values([card("Ula Brent", 1500), card("Vic Sallow", 2000), { roundId: round1, groupNumber: 1, entryId: ids["Wyn Carrow"]!, timekeeperUserId: keeper.id },
    ...Object.values(ids).map((entryId) => ({ roundId: rounds[5]!.id, groupNumber: 1, entryId }))]);
});

const call = (handler: typeof giveRoute, method: string, body: unknown, roundNumber = "1") => handler(
  new Request("http://test/api", { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
  { params: Promise.resolve({ contestId, roundNumber }) },
);
const penaltiesOf = (name: string) => db.select().from(contestPenalties).where(eq(contestPenalties.entryId, ids[name]!)).orderBy(contestPenalties.givenAt);
type Pilot = { name: string; totalTenths: number; penaltyTenths: number; rounds: { pointsTenths: number | null; penaltyPoints: number; phonePenaltyPoints: number; zeroedByPenalty: boolean }[] };
async function pilot(name: string): Promise<Pilot> {
  actAs(member);
  const body = (await (await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) })).json()) as { standings: { pilots: Pilot[] } };
  actAs(officer);
  return body.standings.pilots.find((p) => p.name === name)!;
}

describe("officers' penalties", () => {
  it("401 signed out, 404 a stranger or no such round, 403 a member; bad input is a 422 and writes nothing", async () => {
    const body = { entryId: ids["Ula Brent"], cause: "outside-time", points: 100 };
    actAs(null);
    expect((await call(giveRoute, "POST", body)).status).toBe(401);
    actAs(stranger);
    expect((await call(giveRoute, "POST", body)).status).toBe(404);
    actAs(member);
    expect((await call(giveRoute, "POST", body)).status).toBe(403);
    expect((await call(removeRoute, "DELETE", { penaltyId: randomUUID(), reason: "x" })).status).toBe(403);
    actAs(officer);
    expect((await call(giveRoute, "POST", body, "9")).status).toBe(404);
    for (const bad of [
      { ...body, cause: "late-lunch" },
      { ...body, points: 300 }, // F3K.9.5: 100, not 300
      { ...body, entryId: randomUUID() }, // not drawn in the round
      { ...body, note: "a\u0000b" },
      { ...body, note: "x".repeat(201) },
      { ...body, cause: "other", points: 40_000 },
      { ...body, points: "100" },
    ]) expect((await call(giveRoute, "POST", bad)).status).toBe(422);
    expect(await penaltiesOf("Ula Brent")).toHaveLength(0);
  });

  it("given with who and when; the total drops by its points (F3K.10); removed, it stays listed with who, when and why and the total returns", async () => {
    const before = await pilot("Ula Brent");
    // 150/200 × 1000 = 750.0 (F3K.9.1)
    expect(before.totalTenths).toBe(7500);
    const res = await call(giveRoute, "POST", { entryId: ids["Ula Brent"], cause: "person-in-safety-area", points: 300, note: "Touched a helper" });
    expect(res.status).toBe(201);
    const { id } = (await res.json()) as { id: string };
    const [row] = await penaltiesOf("Ula Brent");
    expect(row).toMatchObject({ id, cause: "person-in-safety-area", points: 300, note: "Touched a helper", givenBy: officer.id, removedAt: null });
    expect(Date.now() - row!.givenAt.getTime()).toBeLessThan(60_000);
    // F3K.10: 750.0 − 300 = 450.0
    expect(await pilot("Ula Brent")).toMatchObject({ totalTenths: 4500, penaltyTenths: 3000 });

    // removed: 404 for another round's or an unknown id; the removal is recorded; a second one is a 409
    expect((await call(removeRoute, "DELETE", { penaltyId: id, reason: "Wrong pilot" }, "2")).status).toBe(404);
    expect((await call(removeRoute, "DELETE", { penaltyId: randomUUID(), reason: "Wrong pilot" })).status).toBe(404);
    expect((await call(removeRoute, "DELETE", { penaltyId: id, reason: "  " })).status).toBe(422);
    expect((await call(removeRoute, "DELETE", { penaltyId: id, reason: "It was Vic's model" })).status).toBe(200);
    const [removed] = await penaltiesOf("Ula Brent");
    expect(removed).toMatchObject({ id, points: 300, removedBy: officer.id, removedReason: "It was Vic's model" });
    expect(removed!.removedAt).toBeInstanceOf(Date);
    expect((await call(removeRoute, "DELETE", { penaltyId: id, reason: "again" })).status).toBe(409);
    expect(await pilot("Ula Brent")).toMatchObject({ totalTenths: 7500, penaltyTenths: 0 });

    // the penalties CSV: each with cause, who and when, the removal too; not through the public link
    actAs(member);
    const csv = await (await resultsRoute(new Request("http://test/api?format=penalties-csv"), { params: Promise.resolve({ contestId }) })).text();
    const rows = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true }).data.filter((r) => r.Pilot === "Ula Brent");
    expect(rows).toEqual([expect.objectContaining({
      Round: "1", Points: "300", Cause: "Model touched a person in a safety area (F3K.4.3)", Note: "Touched a helper", "Given by": officer.name,
      Counts: "no: removed", "Removed by": officer.name, "Why removed": "It was Vic's model",
    })]);
    expect(rows[0]!["Given at"]).toMatch(/\d{2}:\d{2}/);
    expect((await publicRoute(new Request("http://test/api?format=penalties-csv"), { params: Promise.resolve({ token }) })).status).toBe(422);
    actAs(officer);
  });

  it("a contact with a person at launch zeroes the round, and the group's best is then the other pilot's (F3K.4.1, F3K.9.1)", async () => {
    // Vic's 200.0 s was the best; zeroed, Ula's 150.0 s is the best → 1000.0; Vic 0 − 50 = −50.0
    const res = await call(giveRoute, "POST", { entryId: ids["Vic Sallow"], cause: "launch-contact", points: 50 });
    expect(res.status).toBe(201);
    expect((await pilot("Vic Sallow")).rounds[0]).toMatchObject({ pointsTenths: 0, zeroedByPenalty: true, penaltyPoints: 50 });
    expect((await pilot("Vic Sallow")).totalTenths).toBe(-500);
    expect((await pilot("Ula Brent")).rounds[0]!.pointsTenths).toBe(10000);
    const { id } = (await res.json()) as { id: string };
    expect((await call(removeRoute, "DELETE", { penaltyId: id, reason: "The contact was after the launch" })).status).toBe(200);
    expect((await pilot("Vic Sallow")).totalTenths).toBe(10000);
  });

  it("the phone's penalty is not typed again: 409 for the same cause on the phone's counting record, unless the officer says it is another one", async () => {
    // the keeper's phone times Wyn (lane 0): one 120.0 s flight and a 100-point penalty for launching outside the times (F3K.9.5), signed
    actAs(keeper);
    const phone = recorder(deviceId());
    const s = session(keeper.id);
    const r = { ...run(s.id, [{ lane: 0, pilotName: "Wyn Carrow" }], getCatalogueTask("A")), contest: { roundId: round1, slots: [{ lane: 0, entryId: ids["Wyn Carrow"]! }] } };
    const flights = phone.flights(r.id, 0, [120], T0 + 1000);
    const pushed = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [
      phone.at(r.id, T0, { kind: "window-start" }), ...flights,
      phone.at(r.id, T0 + 200_000, { kind: "penalty", lane: 0, points: 100, reason: "Launched in the no-fly time", cause: "outside-time", launchId: flights[0]!.id }),
      phone.at(r.id, T0 + 210_000, { kind: "signed", lane: 0 }),
    ] });
    expect(pushed.body.acks.every((a) => a.status === "applied")).toBe(true);
    const [slot] = await db.select({ runId: groupSlots.runId }).from(groupSlots).where(and(eq(groupSlots.roundId, round1), eq(groupSlots.entryId, ids["Wyn Carrow"]!)));
    expect(slot!.runId).toBe(r.id);
    actAs(officer);
    expect((await pilot("Wyn Carrow")).rounds[0]).toMatchObject({ penaltyPoints: 100, phonePenaltyPoints: 100 });

    const again = await call(giveRoute, "POST", { entryId: ids["Wyn Carrow"], cause: "outside-time", points: 100 });
    expect(again.status).toBe(409);
    expect(((await again.json()) as { error: { code: string } }).error.code).toBe("phone_has_it");
    expect(await penaltiesOf("Wyn Carrow")).toHaveLength(0);
    expect((await pilot("Wyn Carrow")).rounds[0]!.penaltyPoints).toBe(100);
    // another cause is another penalty: 100 (phone) + 300 (officer) = 400
    expect((await call(giveRoute, "POST", { entryId: ids["Wyn Carrow"], cause: "person-in-safety-area", points: 300 })).status).toBe(201);
    expect((await pilot("Wyn Carrow")).rounds[0]).toMatchObject({ penaltyPoints: 400, phonePenaltyPoints: 100 });
    // the same cause in another attempt, said so: counted beside the phone's (500)
    expect((await call(giveRoute, "POST", { entryId: ids["Wyn Carrow"], cause: "outside-time", points: 100, separate: true, note: "Second launch, also early" })).status).toBe(201);
    expect((await pilot("Wyn Carrow")).rounds[0]!.penaltyPoints).toBe(500);
  });

  it("fly-off rounds too, on their own (preliminary penalties do not carry over, F3K.10)", async () => {
    expect((await call(giveRoute, "POST", { entryId: ids["Ula Brent"], cause: "relaunch-outside-field", points: 100 }, "fly-off-1")).status).toBe(201);
    const rows = await penaltiesOf("Ula Brent");
    const [fly] = await db.select({ id: contestRounds.id }).from(contestRounds).where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, true)));
    expect(rows.filter((p) => p.roundId === fly!.id && p.removedAt === null)).toHaveLength(1);
    // the preliminary total is unchanged (750.0 as before: Vic's launch contact was removed, he is the best again)
    expect((await pilot("Ula Brent")).totalTenths).toBe(7500);
  });
});

describe("a dispute's lodged time", () => {
  const lodge = (lodgedAt?: string) => call(lodgeRoute as typeof giveRoute, "POST", { entryId: ids["Vic Sallow"], subject: "Landing not counted", lodgedBy: "Vic Sallow (pilot)", ...(lodgedAt ? { lodgedAt } : {}) });
  it("is the time the officer gives (kept apart from when it was recorded), now when none; not in the future, not more than 2 days before the contest", async () => {
    actAs(officer);
    const earlier = new Date(Date.now() - 3 * 3_600_000);
    expect((await lodge(earlier.toISOString())).status).toBe(201);
    expect((await lodge()).status).toBe(201);
    expect((await lodge(new Date(Date.now() + 3_600_000).toISOString())).status).toBe(422);
    expect((await lodge(new Date(Date.parse(`${today}T00:00:00Z`) - 3 * 86_400_000).toISOString())).status).toBe(422);
    expect((await lodge("yesterday")).status).toBe(422);
    const rows = await db.select().from(contestDisputes).where(eq(contestDisputes.entryId, ids["Vic Sallow"]!)).orderBy(contestDisputes.recordedAt);
    expect(rows).toHaveLength(2);
    expect(rows[0]!.lodgedAt.getTime()).toBe(earlier.getTime());
    expect(Date.now() - rows[0]!.recordedAt.getTime()).toBeLessThan(60_000);
    expect(rows[1]!.lodgedAt.getTime()).toBe(rows[1]!.recordedAt.getTime());
  });
});
