import "./support/session";
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PATCH as changeRoute } from "@/app/api/contests/[contestId]/entries/[entryId]/route";
import { POST as enterRoute } from "@/app/api/contests/[contestId]/entries/route";
import { PUT as cardsRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/cards/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { clubs, contestEntries, contestRounds, contests, groupSlots, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

/**
 * Issue 15, set-up: the officer sets an entry's team and class; a pilot enters as a junior; the
 * contest's rounding of halves and its juniors' own ranking reach the results (one standings value).
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser;
let pilot: MockSessionUser;
let contestId = "";
const ids: Record<string, string> = {};

beforeAll(async () => {
  officer = await freshUser("entries-officer");
  pilot = await freshUser("entries-pilot");
  const [club] = await db.insert(clubs).values({ name: "Entries Club", slug: `entries-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([{ clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: pilot.id, role: "member" }]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Entries Cup", startsOn: "2099-05-02", fieldName: "Low Meadow", drawSeed: 3, halves: "down" }).returning();
  contestId = c!.id;
  const [round] = await db.insert(contestRounds).values({ contestId, number: 1, task: getCatalogueTask("A") }).returning();
  const entries = await db.insert(contestEntries).values(["Oda", "Pim", "Quin"].map((pilotName) => ({ contestId, pilotName, paper: true }))).returning();
  for (const e of entries) ids[e.pilotName] = e.id;
  await db.insert(groupSlots).values(entries.map((e) => ({ roundId: round!.id, groupNumber: 1, entryId: e.id })));
});

const patch = (entryId: string, body: unknown) =>
  changeRoute(new Request("http://test/api", { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), { params: Promise.resolve({ contestId, entryId }) });
const row = async (id: string) => (await db.select().from(contestEntries).where(eq(contestEntries.id, id)))[0]!;

describe("entries: team, class and the junior ranking", () => {
  it("the officer sets a team and a class; an empty team clears it; bad input is a 422 that changes nothing", async () => {
    actAs(officer);
    expect((await patch(ids.Pim!, { team: "  Thermal Hounds ", pilotClass: "junior" })).status).toBe(200);
    expect(await row(ids.Pim!)).toMatchObject({ team: "Thermal Hounds", pilotClass: "junior" });
    expect((await patch(ids.Pim!, { team: "" })).status).toBe(200);
    expect(await row(ids.Pim!)).toMatchObject({ team: null, pilotClass: "junior" });
    for (const bad of [{}, { team: "x".repeat(41) }, { pilotClass: "veteran" }, { team: 7 }, { team: "a\u0000b" }]) {
      const res = await patch(ids.Pim!, bad);
      expect(res.status, JSON.stringify(bad)).toBe(422);
      expect(((await res.json()) as { error: { message: string } }).error.message.length).toBeGreaterThan(0);
    }
    expect(await row(ids.Pim!)).toMatchObject({ team: null, pilotClass: "junior" });
    actAs(pilot);
    expect((await patch(ids.Oda!, { team: "Mine" })).status).toBe(403);
    expect((await row(ids.Oda!)).team).toBeNull();
  });

  it("a pilot enters as a junior", async () => {
    actAs(pilot);
    const res = await enterRoute(new Request("http://test/api", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ modelIds: [], pilotClass: "junior" }) }), { params: Promise.resolve({ contestId }) });
    expect(res.status).toBe(201);
    const { entry } = (await res.json()) as { entry: { id: string } };
    expect((await row(entry.id)).pilotClass).toBe("junior");
  });

  it("the results rank the juniors among themselves and round halves as the contest says", async () => {
    actAs(officer);
    await patch(ids.Quin!, { pilotClass: "junior" });
    // task A (last flight): Oda 160.0 s (best), Pim 100.2 s, Quin 150.0 s; Pim 1002 × 10000 / 1600 = 6262.5 tenths, an exact half: cut down → 626.2
    const put = await cardsRoute(new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify({ groupNumber: 1, cards: [
      { entryId: ids.Oda, flights: [1600], penaltyPoints: 0, signed: true },
      { entryId: ids.Pim, flights: [1002], penaltyPoints: 0, signed: true },
      { entryId: ids.Quin, flights: [1500], penaltyPoints: 0, signed: true },
    ] }) }), { params: Promise.resolve({ contestId, roundNumber: "1" }) });
    expect(put.status).toBe(200);
    const res = await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) });
    const { standings } = (await res.json()) as { standings: { pilots: { name: string; rounds: { pointsTenths: number }[] }[]; juniors: { name: string; rank: number; overallRank: number }[] } };
    expect(standings.pilots.find((p) => p.name === "Pim")!.rounds[0]!.pointsTenths).toBe(6262);
    expect(standings.juniors.map((j) => [j.name, j.rank, j.overallRank])).toEqual([["Quin", 1, 2], ["Pim", 2, 3]]);
  });
});
