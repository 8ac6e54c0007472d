import "./support/session";
import { randomBytes, randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as lodgeRoute, PUT as resolveRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/disputes/route";
import { POST as grantRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/reflights/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { GET as publicRoute } from "@/app/api/public-results/[token]/route";
import { clubs, contestDisputes, contestEntries, contestRounds, contests, groupSlots, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

/**
 * Issue 15, disputes recorded by officers: an officer writes down a protest about a pilot's result in
 * a round (who lodged it; who recorded it and when), resolves it with an outcome (who and when); an
 * upheld one names the existing action that carries it out, which must be done first. While open, the
 * standings (members and the public link, no names) mark the result "under dispute"; a dispute changes
 * no points by itself.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser;
let contestId = "";
const token = randomBytes(32).toString("base64url");
const ids: Record<string, string> = {};

beforeAll(async () => {
  [officer, member] = (await Promise.all(["dp-officer", "dp-member"].map((l) => freshUser(l)))) as [MockSessionUser, MockSessionUser];
  const [club] = await db.insert(clubs).values({ name: "Protest Club", slug: `protest-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([{ clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: member.id, role: "member" }]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Protest Cup", startsOn: "2027-03-13", fieldName: "Long Meadow", drawSeed: 9, publicToken: token }).returning();
  contestId = c!.id;
  const rounds = await db.insert(contestRounds).values([
    ...["A", "B", "D", "F", "G"].map((l, i) => ({ contestId, number: i + 1, task: getCatalogueTask(l as "A") })),
    { contestId, number: 1, isFlyOff: true, task: getCatalogueTask("A") },
  ]).returning();
  const entries = await db.insert(contestEntries).values(["Ula Brent", "Vic Sallow"].map((pilotName) => ({ contestId, pilotName, paper: true }))).returning();
  for (const e of entries) ids[e.pilotName] = e.id;
  // round 1, task A (last flight, F3K.11.1 as the catalogue has it): Ula 150.0 s, Vic 200.0 s, both signed; both drawn in fly-off round 1
  const card = (name: string, tenths: number) => ({ roundId: rounds[0]!.id, groupNumber: 1, entryId: ids[name]!, paperFlights: [tenths], signedAt: new Date(), signedFrom: "paper card" });
  await db.insert(groupSlots).values([card("Ula Brent", 1500), card("Vic Sallow", 2000),
    ...["Ula Brent", "Vic Sallow"].map((n) => ({ roundId: rounds[5]!.id, groupNumber: 1, entryId: ids[n]! }))]);
});

const call = (handler: typeof lodgeRoute, method: string, body: unknown, roundNumber = "1") => handler(
  new Request("http://test/api", { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
  { params: Promise.resolve({ contestId, roundNumber }) },
);
const disputesOf = (name: string) => db.select().from(contestDisputes).where(eq(contestDisputes.entryId, ids[name]!));
type Cell = { pointsTenths: number | null; disputed: boolean };
async function round1Cells(viaPublic = false): Promise<{ body: string; cells: Record<string, Cell> }> {
  const res = viaPublic
    ? await publicRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ token }) })
    : await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) });
  const body = await res.text();
  const parsed = JSON.parse(body) as { standings: { pilots: { name: string; rounds: Cell[] }[] } };
  return { body, cells: Object.fromEntries(parsed.standings.pilots.map((p) => [p.name, p.rounds[0]!])) };
}

describe("disputes", () => {
  it("only an officer records one, for a pilot drawn in the round; bad input is a 4xx and writes nothing", async () => {
    actAs(member);
    expect((await call(lodgeRoute, "POST", { entryId: ids["Ula Brent"], subject: "Landing not counted", lodgedBy: "Ula Brent (pilot)" })).status).toBe(403);
    actAs(officer);
    for (const body of [
      { entryId: randomUUID(), subject: "Landing not counted", lodgedBy: "Ula Brent (pilot)" },
      { entryId: ids["Ula Brent"], subject: "   ", lodgedBy: "Ula Brent (pilot)" },
      { entryId: ids["Ula Brent"], subject: "a\u0000b", lodgedBy: "Ula Brent (pilot)" },
      { entryId: ids["Ula Brent"], subject: "x".repeat(301), lodgedBy: "Ula Brent (pilot)" },
      { entryId: ids["Ula Brent"], subject: "Landing not counted" },
    ]) expect((await call(lodgeRoute, "POST", body)).status).toBe(422);
    expect(await disputesOf("Ula Brent")).toHaveLength(0);
  });

  it("recorded open with who lodged it, who recorded it and when; the standings mark it without names or points changed", async () => {
    actAs(officer);
    const before = await round1Cells();
    const res = await call(lodgeRoute, "POST", { entryId: ids["Ula Brent"], subject: "The landing was inside the working time", lodgedBy: "Team manager of Ula Brent" });
    expect(res.status).toBe(201);
    const [row] = await disputesOf("Ula Brent");
    expect(row).toMatchObject({ status: "open", recordedBy: officer.id, lodgedBy: "Team manager of Ula Brent", subject: "The landing was inside the working time", resolvedAt: null });
    expect(row!.lodgedAt).toBeInstanceOf(Date);
    // members' results: marked; 150/200 × 1000 = 750.0 (F3K.9.1) unchanged by the dispute
    const members = await round1Cells();
    expect(members.cells["Ula Brent"]).toMatchObject({ disputed: true, pointsTenths: 7500 });
    expect(members.cells["Ula Brent"]!.pointsTenths).toBe(before.cells["Ula Brent"]!.pointsTenths);
    expect(members.cells["Vic Sallow"]!.disputed).toBe(false);
    // the public link: marked, and neither who lodged it nor what it is about
    actAs(null);
    const pub = await round1Cells(true);
    expect(pub.cells["Ula Brent"]!.disputed).toBe(true);
    expect(pub.body).not.toContain("Team manager");
    expect(pub.body).not.toContain("working time");
    const csv = await (await publicRoute(new Request("http://test/api?format=csv"), { params: Promise.resolve({ token }) })).text();
    expect(csv).toMatch(/Ula Brent[^\n]*round 1 result under dispute/);
  });

  it("upheld by a re-flight only once the re-flight is granted; then resolved with who and when, once", async () => {
    actAs(officer);
    const [d] = await disputesOf("Ula Brent");
    const upheld = { disputeId: d!.id, status: "upheld", outcome: "Landing seen inside the time by the group's judge: re-flight", action: "reflight" };
    actAs(member);
    expect((await call(resolveRoute, "PUT", upheld)).status).toBe(403);
    actAs(officer);
    // the action named is not done yet: refused, the dispute stays open
    expect((await call(resolveRoute, "PUT", upheld)).status).toBe(422);
    // an upheld dispute must name its action, a rejected one none (schema)
    expect((await call(resolveRoute, "PUT", { ...upheld, action: null })).status).toBe(422);
    expect((await call(resolveRoute, "PUT", { ...upheld, status: "rejected" })).status).toBe(422);
    // another round's address: not this round's dispute
    expect((await call(resolveRoute, "PUT", upheld, "2")).status).toBe(404);
    expect((await disputesOf("Ula Brent"))[0]!.status).toBe("open");
    // the existing action: a re-flight with the original group (F3K.9.6)
    expect((await call(grantRoute, "POST", { entryId: ids["Ula Brent"], cause: "organiser", placement: "original-group", groupNumber: 1 })).status).toBe(201);
    expect((await call(resolveRoute, "PUT", upheld)).status).toBe(200);
    const [row] = await disputesOf("Ula Brent");
    expect(row).toMatchObject({ status: "upheld", action: "reflight", resolvedBy: officer.id, outcome: upheld.outcome });
    expect(row!.resolvedAt).toBeInstanceOf(Date);
    // the first resolution stands
    expect((await call(resolveRoute, "PUT", { ...upheld, status: "rejected", action: null })).status).toBe(409);
    expect((await round1Cells()).cells["Ula Brent"]!.disputed).toBe(false);
  });

  it("a fly-off round's result can be disputed and rejected", async () => {
    actAs(officer);
    expect((await call(lodgeRoute, "POST", { entryId: ids["Vic Sallow"], subject: "Wrong task announced", lodgedBy: "Vic Sallow (pilot)" }, "fly-off-1")).status).toBe(201);
    const [d] = await disputesOf("Vic Sallow");
    const [flyOff] = await db.select({ id: contestRounds.id }).from(contestRounds).where(and(eq(contestRounds.isFlyOff, true), eq(contestRounds.contestId, contestId)));
    expect(d!.roundId).toBe(flyOff!.id);
    expect((await call(resolveRoute, "PUT", { disputeId: d!.id, status: "rejected", outcome: "The task board showed task A" }, "fly-off-1")).status).toBe(200);
    expect((await disputesOf("Vic Sallow"))[0]).toMatchObject({ status: "rejected", action: null, resolvedBy: officer.id });
  });
});
