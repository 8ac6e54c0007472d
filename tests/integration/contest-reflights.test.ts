import "./support/session";
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as grantRoute, PUT as recordRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/reflights/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { clubs, contestEntries, contestReflights, contestRounds, contests, groupSlots, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

/**
 * Issue 15, re-flights recorded by officers (F3K.9.6, F3K.4.2): an officer grants a pilot a re-flight
 * (who and when kept), records its paper card, and the standings (one value for the results page,
 * CSV, PDF and public link) follow which result stands. Task A (last flight, 300 s cap).
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser;
let contestId = "";
let round1 = "";
const ids: Record<string, string> = {};

beforeAll(async () => {
  [officer, member] = (await Promise.all(["rf-officer", "rf-member"].map((l) => freshUser(l)))) as [MockSessionUser, MockSessionUser];
  const [club] = await db.insert(clubs).values({ name: "Reflight Club", slug: `reflight-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([{ clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: member.id, role: "member" }]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Second Chance Cup", startsOn: "2027-03-06", fieldName: "Low Meadow", drawSeed: 4 }).returning();
  contestId = c!.id;
  const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
  round1 = rounds[0]!.id;
  const entries = await db.insert(contestEntries).values(["Ada Fenn", "Bo Marsh", "Cy Rook", "Di Oakes"].map((pilotName) => ({ contestId, pilotName, paper: true }))).returning();
  for (const e of entries) ids[e.pilotName] = e.id;
  const card = (name: string, group: number, tenths: number) => ({ roundId: round1, groupNumber: group, entryId: ids[name]!, paperFlights: [tenths], signedAt: new Date(), signedFrom: "paper card" });
  // group 1: Ada 100.0 s (an outsider moved her model), Bo 200.0 s; group 2: Cy 250.0 s, Di 200.0 s
  await db.insert(groupSlots).values([card("Ada Fenn", 1, 1000), card("Bo Marsh", 1, 2000), card("Cy Rook", 2, 2500), card("Di Oakes", 2, 2000)]);
});

const call = (handler: typeof grantRoute, method: string, body: unknown, roundNumber = "1") => handler(
  new Request("http://test/api", { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
  { params: Promise.resolve({ contestId, roundNumber }) },
);
const reflight = async (name: string) => (await db.select().from(contestReflights).where(eq(contestReflights.entryId, ids[name]!)))[0];
/** Round 1's cell of `name` as the results route (the officer is a member too) returns it. */
async function round1Cell(name: string) {
  const res = await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) });
  const body = (await res.json()) as { standings: { pilots: { name: string; rounds: { groupNumber: number; resultTenths: number; pointsTenths: number; reflight: unknown }[] }[] } };
  return body.standings.pilots.find((p) => p.name === name)!.rounds[0]!;
}

describe("re-flights", () => {
  it("only an officer grants one; a later group must be one flying after the pilot's", async () => {
    actAs(member);
    expect((await call(grantRoute, "POST", { entryId: ids["Ada Fenn"], cause: "outsider-moved-model", placement: "later-group", groupNumber: 2 })).status).toBe(403);
    actAs(officer);
    // group 1 is Ada's own, group 7 does not fly in this round: refused, nothing stored
    for (const groupNumber of [1, 7]) {
      const res = await call(grantRoute, "POST", { entryId: ids["Ada Fenn"], cause: "outsider-moved-model", placement: "later-group", groupNumber });
      expect(res.status).toBe(422);
    }
    // a cause the rules do not give (F3K.9.6 lists organiser, launch collision, outsider, rain)
    expect((await call(grantRoute, "POST", { entryId: ids["Ada Fenn"], cause: "bad-luck", placement: "later-group", groupNumber: 2 })).status).toBe(422);
    // a reason PostgreSQL text cannot hold (NUL, a lone surrogate) is a 422 with a sentence, not a 500
    for (const reason of ["a\u0000b", "\ud800"]) {
      const res = await call(grantRoute, "POST", { entryId: ids["Ada Fenn"], cause: "outsider-moved-model", placement: "later-group", groupNumber: 2, reason });
      expect(res.status).toBe(422);
    }
    expect(await reflight("Ada Fenn")).toBeUndefined();
  });

  it("granted with who and when; once per pilot and round", async () => {
    actAs(officer);
    const res = await call(grantRoute, "POST", { entryId: ids["Ada Fenn"], cause: "outsider-moved-model", placement: "later-group", groupNumber: 2, reason: "A spectator picked it up" });
    expect(res.status).toBe(201);
    expect(await reflight("Ada Fenn")).toMatchObject({ grantedBy: officer.id, placement: "later-group", groupNumber: 2, entitled: true, reason: "A spectator picked it up" });
    expect((await reflight("Ada Fenn"))!.grantedAt).toBeInstanceOf(Date);
    expect((await call(grantRoute, "POST", { entryId: ids["Ada Fenn"], cause: "rain", placement: "later-group", groupNumber: 2 })).status).toBe(409);
    // not yet flown: the first result stands in group 1 (100/200 = 500.0)
    expect(await round1Cell("Ada Fenn")).toMatchObject({ groupNumber: 1, resultTenths: 1000, pointsTenths: 5000, reflight: null });
  });

  it("the re-flight's card, signed: the better result stands, normalised in the group it was flown in (F3K.9.6, F3K.9.1)", async () => {
    actAs(member);
    expect((await call(recordRoute, "PUT", { entryId: ids["Ada Fenn"], flights: [2400], runId: null, lane: null, signed: true })).status).toBe(403);
    actAs(officer);
    // a pilot with no re-flight: refused
    expect((await call(recordRoute, "PUT", { entryId: ids["Bo Marsh"], flights: [2400], runId: null, lane: null, signed: true })).status).toBe(422);
    // unsigned first: a later-group re-flyer keeps the better, and an unsigned 240.0 s counts as 0 (F3K.1.2) → 100.0 s stands
    expect((await call(recordRoute, "PUT", { entryId: ids["Ada Fenn"], flights: [2400], runId: null, lane: null, signed: false })).status).toBe(200);
    expect(await round1Cell("Ada Fenn")).toMatchObject({ groupNumber: 1, resultTenths: 1000, reflight: { stands: "original", reflightTenths: 0 } });
    expect((await call(recordRoute, "PUT", { entryId: ids["Ada Fenn"], flights: [2400], runId: null, lane: null, signed: true })).status).toBe(200);
    expect(await reflight("Ada Fenn")).toMatchObject({ paperFlights: [2400], recordedBy: officer.id, signedFrom: "marked by an officer" });
    // 240.0 s stands in group 2 (best Cy 250.0): 240/250 × 1000 = 960.0; Bo alone in group 1: 1000.0
    expect(await round1Cell("Ada Fenn")).toMatchObject({ groupNumber: 2, resultTenths: 2400, pointsTenths: 9600, reflight: { stands: "reflight", originalTenths: 1000, reflightTenths: 2400 } });
    expect((await round1Cell("Bo Marsh")).pointsTenths).toBe(10000);
    // the CSV reads the same standings; a member reads it too
    actAs(member);
    const csv = await (await resultsRoute(new Request("http://test/api?format=csv"), { params: Promise.resolve({ contestId }) })).text();
    expect(csv).toMatch(/Ada Fenn[^\n]*960\.0/);
  });

  it("the original group at the end of the round: the re-flight stands even if worse (F3K.9.6)", async () => {
    actAs(officer);
    expect((await call(grantRoute, "POST", { entryId: ids["Cy Rook"], cause: "launch-collision", placement: "original-group", groupNumber: 99 })).status).toBe(201);
    // flown with the original group: its own group, whatever was sent (F3K.4.2: a collision at launch gives a re-flight)
    expect((await reflight("Cy Rook"))!.groupNumber).toBe(2);
    expect((await call(recordRoute, "PUT", { entryId: ids["Cy Rook"], flights: [1200], runId: null, lane: null, signed: true })).status).toBe(200);
    // group 2: Ada 240.0 (best) → Cy's 120.0 stands though worse than 250.0: 120/240 = 500.0
    expect(await round1Cell("Cy Rook")).toMatchObject({ groupNumber: 2, resultTenths: 1200, pointsTenths: 5000, reflight: { stands: "reflight" } });
    expect((await round1Cell("Ada Fenn")).pointsTenths).toBe(10000);
  });

  it("bad input is a 4xx and changes nothing", async () => {
    actAs(officer);
    const before = await reflight("Ada Fenn");
    for (const body of [
      { entryId: ids["Ada Fenn"], flights: [2400], runId: randomUUID(), lane: 0, signed: true },
      { entryId: ids["Ada Fenn"], flights: [2 ** 31], runId: null, lane: null, signed: true },
      { entryId: ids["Ada Fenn"], flights: null, runId: randomUUID(), lane: 0, signed: true },
    ]) expect((await call(recordRoute, "PUT", body)).status).toBeGreaterThanOrEqual(400);
    expect(await reflight("Ada Fenn")).toEqual(before);
  });
});
