import "./support/session";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as createRoute } from "@/app/api/clubs/[slug]/contests/route";
import { POST as flyOffRoute } from "@/app/api/contests/[contestId]/draw/fly-off/route";
import { POST as lockRoute } from "@/app/api/contests/[contestId]/draw/lock/route";
import { POST as redrawRoute } from "@/app/api/contests/[contestId]/draw/redraw/route";
import { POST as drawRoute } from "@/app/api/contests/[contestId]/draw/route";
import { DELETE as withdrawRoute } from "@/app/api/contests/[contestId]/entries/[entryId]/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { PUT as cardsRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/cards/route";
import { clubs, contestDrawChanges, contestEntries, contestReflights, contestRounds, groupSlots, memberships } from "@/db/schema";
import type { Standings } from "@/lib/contests/standings";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

/**
 * Fly-off edge cases (issue 15, F3K.10: the fly-off's pilots come from the preliminary order).
 * (a) A new draw of the preliminary rounds makes the fly-off's pilots stale: a fly-off drawn
 *     without results goes with the old draw; while the fly-off has a result, the re-draw is
 *     refused with the reason and nothing changes (flown results are never deleted by a draw of
 *     other rounds).
 * (b) A fly-off pilot who withdraws keeps the rounds flown and scores 0 in the others (common
 *     practice; RULES.md is silent), and does not keep the other rounds from counting as complete.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser;
let slug = "";
const today = new Date().toISOString().slice(0, 10);
const json = (method: string, body?: unknown) => new Request("http://test/api", { method, headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
const params = <T extends Record<string, string>>(p: T) => ({ params: Promise.resolve(p) });
const names = ["Ash", "Bryn", "Cole", "Dell", "Eryl"];
/** Preliminary results in tenths, one flight each, so the order is Ash, Bryn, Cole, Dell, Eryl. */
const prelim: Record<string, number> = { Ash: 1100, Bryn: 1000, Cole: 900, Dell: 800, Eryl: 600 };

beforeAll(async () => {
  officer = await freshUser("foe-officer");
  slug = `fen-edge-${randomUUID().slice(0, 8)}`;
  const [club] = await db.insert(clubs).values({ name: "Fen Edge Club", slug }).returning();
  await db.insert(memberships).values({ clubId: club!.id, userId: officer.id, role: "officer" });
});

/** A contest of 5 preliminary rounds (A, B, D, F, G) and 3 fly-off rounds (A, B, D) for 3 pilots, the five pilots entered on paper and drawn through the route. */
async function contestWithPilots(name: string): Promise<{ contestId: string; ids: Record<string, string> }> {
  actAs(officer);
  const made = await createRoute(json("POST", {
    name, startsOn: today, fieldName: "Long Acre", rounds: ["A", "B", "D", "F", "G"].map((letter) => ({ letter })),
    flyOffRounds: ["A", "B", "D"].map((letter) => ({ letter })), flyOffPilots: 3,
    maxGroupSize: 6, prepMinutes: 5, noFlySeconds: 60, dropRule: "f3k", practice: false,
  }), params({ slug }));
  expect(made.status).toBe(201);
  const contestId = ((await made.json()) as { contest: { id: string } }).contest.id;
  const rows = await db.insert(contestEntries).values(names.map((pilotName) => ({ contestId, pilotName, paper: true }))).returning();
  const ids = Object.fromEntries(rows.map((r) => [r.pilotName, r.id]));
  expect((await drawRoute(json("POST", { seed: 7 }), params({ contestId }))).status).toBe(201);
  return { contestId, ids };
}

const card = (id: string, flights: number[]) => ({ entryId: id, flights, penaltyPoints: 0, signed: true });
const saveCards = (contestId: string, round: string, cards: ReturnType<typeof card>[]) =>
  cardsRoute(json("PUT", { groupNumber: 1, cards }), params({ contestId, roundNumber: round }));

/** Every preliminary round scored (5 pilots ≤ 6: one group a round), then the fly-off drawn: Ash, Bryn, Cole. */
async function scoreAndDrawFlyOff(contestId: string, ids: Record<string, string>) {
  for (const n of ["1", "2", "3", "4", "5"]) expect((await saveCards(contestId, n, names.map((x) => card(ids[x]!, [prelim[x]!])))).status).toBe(200);
  const drawn = await flyOffRoute(json("POST", {}), params({ contestId }));
  expect(drawn.status).toBe(201);
  expect(((await drawn.json()) as { pilots: string[] }).pilots).toEqual(["Ash", "Bryn", "Cole"]);
}

async function slotsOf(contestId: string, flyOff: boolean) {
  return db.select({ entryId: groupSlots.entryId, paperFlights: groupSlots.paperFlights, roundNumber: contestRounds.number })
    .from(groupSlots).innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
    .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, flyOff)));
}

async function standingsOf(contestId: string): Promise<Standings> {
  const res = await resultsRoute(new Request("http://test/api?format=json"), params({ contestId }));
  expect(res.status).toBe(200);
  return ((await res.json()) as { standings: Standings }).standings;
}

describe("(a) drawing the preliminary rounds again after the fly-off is drawn", () => {
  it("a fly-off without results goes with the old draw: its slots are cleared and the results show no fly-off", async () => {
    const { contestId, ids } = await contestWithPilots("Edge Cup clear");
    await scoreAndDrawFlyOff(contestId, ids);
    expect(await slotsOf(contestId, true)).toHaveLength(9);
    actAs(officer);
    // the preliminary rounds hold cards: the draw replaces them only when told to (contest-draw-results.test.ts)
    const res = await drawRoute(json("POST", { seed: 8, replaceResults: true }), params({ contestId }));
    expect(res.status).toBe(201);
    expect(await res.json()).toMatchObject({ seed: 8, flyOffCleared: true });
    expect(await slotsOf(contestId, true)).toEqual([]);
    expect((await slotsOf(contestId, false)).filter((s) => s.paperFlights === null)).toHaveLength(25); // the new draw, no results yet
    expect((await standingsOf(contestId)).flyOff).toBeNull();
    // a later full draw has no fly-off to clear
    expect(await (await drawRoute(json("POST", { seed: 9 }), params({ contestId }))).json()).toMatchObject({ flyOffCleared: false });
  });

  it("while the fly-off has a result, a full draw is refused with the reason and nothing changes", async () => {
    const { contestId, ids } = await contestWithPilots("Edge Cup refuse");
    await scoreAndDrawFlyOff(contestId, ids);
    expect((await saveCards(contestId, "fly-off-1", [card(ids.Ash!, [1500])])).status).toBe(200);
    const before = { prelim: await slotsOf(contestId, false), flyOff: await slotsOf(contestId, true) };
    actAs(officer);
    const res = await drawRoute(json("POST", { seed: 8 }), params({ contestId }));
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatchObject({
      code: "fly_off_results",
      message: "The fly-off has results already: a new draw of the preliminary rounds would change who qualifies for it. Nothing was drawn again (to draw anyway, draw the fly-off again deleting its results first).",
    });
    expect(await slotsOf(contestId, false)).toEqual(before.prelim);
    expect(await slotsOf(contestId, true)).toEqual(before.flyOff);
  });

  it("a re-draw of the remaining rounds (after the lock) clears a fly-off without results and says so; with a fly-off result it is refused", async () => {
    // The fly-off route needs every round scored, so the state "fly-off drawn, round 5 open" is written here directly:
    // the re-draw route must hold whatever the rounds hold.
    const { contestId, ids } = await contestWithPilots("Edge Cup redraw");
    actAs(officer);
    expect((await lockRoute(json("POST", {}), params({ contestId }))).status).toBe(200);
    const flyRounds = await db.select({ id: contestRounds.id }).from(contestRounds).where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, true)));
    const seedFlyOff = () => db.insert(groupSlots).values(flyRounds.flatMap((r) => ["Ash", "Bryn", "Cole"].map((n) => ({ roundId: r.id, groupNumber: 1, entryId: ids[n]! }))));
    await seedFlyOff();
    // a re-flight granted in a fly-off round, with a result: the fly-off has results
    await db.insert(contestReflights).values({ roundId: flyRounds[0]!.id, entryId: ids.Bryn!, cause: "launch-collision", placement: "original-group", groupNumber: 1, paperFlights: [1200] });
    const refused = await redrawRoute(json("POST", { fromRound: 5, seed: 3 }), params({ contestId }));
    expect(refused.status).toBe(409);
    expect((await refused.json()).error.code).toBe("fly_off_results");
    expect(await slotsOf(contestId, true)).toHaveLength(9);
    expect(await db.$count(contestDrawChanges, eq(contestDrawChanges.contestId, contestId))).toBe(0);

    await db.update(contestReflights).set({ paperFlights: null }).where(eq(contestReflights.entryId, ids.Bryn!));
    const res = await redrawRoute(json("POST", { fromRound: 5, seed: 3 }), params({ contestId }));
    expect(res.status).toBe(201);
    expect(((await res.json()) as { summary: string }).summary).toBe("Round 5 drawn again for 5 pilots (seed 3); the fly-off draw was cleared.");
    expect(await slotsOf(contestId, true)).toEqual([]);
    expect(await db.$count(contestReflights, eq(contestReflights.entryId, ids.Bryn!))).toBe(0);
  });
});

describe("(b) a fly-off pilot who withdraws", () => {
  it("does not keep the fly-off rounds from counting; keeps the round flown, scores 0 in the others and shows as withdrawn", async () => {
    const { contestId, ids } = await contestWithPilots("Edge Cup withdraw");
    await scoreAndDrawFlyOff(contestId, ids);
    // Fly-off round 1 (task A, F3K.11.1: the last flight): all three fly; Cole is best there.
    expect((await saveCards(contestId, "fly-off-1", [card(ids.Ash!, [1600]), card(ids.Bryn!, [1200]), card(ids.Cole!, [2000])])).status).toBe(200);
    actAs(officer);
    expect((await withdrawRoute(new Request("http://test/api", { method: "DELETE" }), params({ contestId, entryId: ids.Cole! }))).status).toBe(200);
    // Rounds 2 (task B, F3K.11.2: the last two flights) and 3 (task D, F3K.11.4: both flights) without Cole.
    expect((await saveCards(contestId, "fly-off-2", [card(ids.Ash!, [1000, 1000]), card(ids.Bryn!, [1000, 1500])])).status).toBe(200);
    expect((await saveCards(contestId, "fly-off-3", [card(ids.Ash!, [1200, 1300]), card(ids.Bryn!, [1000, 1000])])).status).toBe(200);

    const { flyOff, final } = await standingsOf(contestId);
    expect(flyOff).not.toBeNull();
    expect(flyOff!.rounds.map((r) => r.number)).toEqual([1, 2, 3]);
    expect(flyOff!.counted).toBe(true); // 3 complete rounds (F3K.10 fly-off of 3–6 rounds)
    // Points per round, best = 1000 (F3K.9.1), computed by hand:
    //   round 1: Cole 200.0 s best → Ash 1600/2000 = 800.0, Bryn 1200/2000 = 600.0, Cole 1000.0
    //   round 2: Bryn 250.0 s best → Ash 200/250 = 800.0, Bryn 1000.0; Cole none (0)
    //   round 3: Ash 250.0 s best → Ash 1000.0, Bryn 200/250 = 800.0; Cole none (0)
    const row = (n: string) => flyOff!.pilots.find((p) => p.name === n)!;
    expect(row("Ash").rounds.map((c) => c.pointsTenths)).toEqual([8000, 8000, 10000]);
    expect(row("Bryn").rounds.map((c) => c.pointsTenths)).toEqual([6000, 10000, 8000]);
    expect(row("Cole").rounds.map((c) => c.pointsTenths)).toEqual([10000, null, null]);
    expect([row("Ash").totalTenths, row("Bryn").totalTenths, row("Cole").totalTenths]).toEqual([26000, 24000, 10000]);
    expect([row("Ash").withdrawn, row("Bryn").withdrawn, row("Cole").withdrawn]).toEqual([false, false, true]);
    // The fly-off decides the top places; the withdrawn qualifier stays third, ahead of the pilots who did not qualify.
    expect(final.slice(0, 5).map((f) => f.name)).toEqual(["Ash", "Bryn", "Cole", "Dell", "Eryl"]);
  });
});
