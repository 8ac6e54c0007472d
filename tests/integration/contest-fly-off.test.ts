import "./support/session";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as createRoute } from "@/app/api/clubs/[slug]/contests/route";
import { POST as flyOffRoute } from "@/app/api/contests/[contestId]/draw/fly-off/route";
import { PUT as cardsRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/cards/route";
import { PUT as keepersRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/timekeepers/route";
import { dutiesOf } from "@/db/queries/contest-timekeepers";
import { clubs, contestEntries, contestReflights, contestRounds, contests, groupSlots, memberships } from "@/db/schema";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

/**
 * The fly-off (issue 15, F3K.10: 3–6 rounds, task M for fly-offs only, preliminary points do not
 * carry over): planned at set-up, drawn by the officer from the standings' preliminary order once
 * every preliminary round is scored, its rounds reached as "fly-off-N" for paper cards and
 * timekeepers, the timekeeper's pull naming the round a fly-off round.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, keeper: MockSessionUser;
let slug = "";
const today = new Date().toISOString().slice(0, 10);
const json = (method: string, body: unknown) => new Request("http://test/api", { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const setup = (more: Record<string, unknown>) => ({
  name: "Fen Cup", startsOn: today, fieldName: "Long Acre", rounds: ["A", "B", "D", "F", "G"].map((letter) => ({ letter })),
  maxGroupSize: 6, prepMinutes: 5, noFlySeconds: 60, dropRule: "f3k", practice: false, ...more,
});
const create = (body: unknown) => createRoute(json("POST", body), { params: Promise.resolve({ slug }) });
const drawFlyOff = (contestId: string, body: unknown = {}) => flyOffRoute(json("POST", body), { params: Promise.resolve({ contestId }) });
const cards = (contestId: string, roundNumber: string, body: unknown) => cardsRoute(json("PUT", body), { params: Promise.resolve({ contestId, roundNumber }) });

beforeAll(async () => {
  [officer, keeper] = (await Promise.all(["fo-officer", "fo-keeper"].map((l) => freshUser(l)))) as [MockSessionUser, MockSessionUser];
  slug = `fen-${randomUUID().slice(0, 8)}`;
  const [club] = await db.insert(clubs).values({ name: "Fen Club", slug }).returning();
  await db.insert(memberships).values([{ clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: keeper.id, role: "member" }]);
});

describe("planning a fly-off at set-up", () => {
  it("stores its rounds (task M allowed there) apart from the preliminary ones, and how many pilots fly", async () => {
    actAs(officer);
    const res = await create(setup({ name: "Fen Cup plan", flyOffRounds: ["M", "A", "B"].map((letter) => ({ letter })), flyOffPilots: 3 }));
    expect(res.status).toBe(201);
    const { contest } = (await res.json()) as { contest: { id: string } };
    const rounds = await db.select().from(contestRounds).where(eq(contestRounds.contestId, contest.id));
    expect(rounds.filter((r) => r.isFlyOff).map((r) => [r.number, (r.task as { letter: string }).letter]).sort()).toEqual([[1, "M"], [2, "A"], [3, "B"]]);
    expect(rounds.filter((r) => !r.isFlyOff)).toHaveLength(5);
    expect((await db.select().from(contests).where(eq(contests.id, contest.id)))[0]!.flyOffPilots).toBe(3);
  });
  it("refuses 2 fly-off rounds, task M in a preliminary round, rounds without the number of pilots: 422, nothing stored", async () => {
    actAs(officer);
    const before = await db.$count(contests);
    for (const [body, message] of [
      [setup({ flyOffRounds: [{ letter: "A" }, { letter: "B" }], flyOffPilots: 3 }), "A fly-off has at least 3 rounds (F3K.10)."],
      [setup({ rounds: ["A", "B", "D", "F", "M"].map((letter) => ({ letter })) }), "Round 5: task M is for fly-off rounds only (F3K.10)."],
      [setup({ flyOffRounds: [{ letter: "A" }, { letter: "B" }, { letter: "C" }] }), "Give how many pilots fly the fly-off."],
    ] as const) {
      const res = await create(body);
      expect(res.status).toBe(422);
      expect(JSON.stringify(await res.json())).toContain(message);
    }
    expect(await db.$count(contests)).toBe(before);
  });
});

describe("drawing and flying the fly-off", () => {
  let contestId = "";
  const ids: Record<string, string> = {};
  const names = ["Ash", "Bryn", "Cole", "Dell", "Eryl"];
  const prelim: Record<string, number> = { Ash: 1100, Bryn: 1000, Cole: 900, Dell: 900, Eryl: 600 };

  beforeAll(async () => {
    actAs(officer);
    const res = await create(setup({ name: "Fen Cup fly", flyOffRounds: ["M", "A", "B"].map((letter) => ({ letter })), flyOffPilots: 3 }));
    contestId = ((await res.json()) as { contest: { id: string } }).contest.id;
    const rows = await db.insert(contestEntries).values(names.map((pilotName) => ({ contestId, pilotName, paper: true }))).returning();
    for (const r of rows) ids[r.pilotName] = r.id;
    await db.update(contests).set({ drawSeed: 1 }).where(eq(contests.id, contestId));
    const rounds = await db.select().from(contestRounds).where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, false)));
    await db.insert(groupSlots).values(rounds.flatMap((r) => names.map((n) => ({ roundId: r.id, groupNumber: 1, entryId: ids[n]! }))));
  });
  const card = (name: string, flights: number[]) => ({ entryId: ids[name]!, flights, penaltyPoints: 0, signed: true });

  it("is refused while a preliminary round is open; nothing is drawn", async () => {
    actAs(officer);
    for (const n of ["1", "2", "3", "4"]) expect((await cards(contestId, n, { groupNumber: 1, cards: names.map((x) => card(x, [prelim[x]!])) })).status).toBe(200);
    const res = await drawFlyOff(contestId);
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toBe("Score every preliminary round before the fly-off is drawn: round 5 has 5 pilots without a result.");
    expect(await flyOffSlots()).toEqual([]);
  });

  it("draws the top 3 and Dell, tied with Cole for 3rd (common practice), into one group of each fly-off round", async () => {
    actAs(officer);
    expect((await cards(contestId, "5", { groupNumber: 1, cards: names.map((x) => card(x, [prelim[x]!])) })).status).toBe(200);
    const res = await drawFlyOff(contestId);
    expect(res.status).toBe(201);
    expect(await res.json()).toEqual({ pilots: ["Ash", "Bryn", "Cole", "Dell"], tiedAtCutOff: ["Cole", "Dell"] });
    const slots = await flyOffSlots();
    expect(slots).toHaveLength(12);
    expect(new Set(slots.map((s) => s.groupNumber))).toEqual(new Set([1]));
  });

  it("fly-off rounds take paper cards and timekeepers at fly-off-N; the duty says it is a fly-off round", async () => {
    actAs(officer);
    const saved = await cards(contestId, "fly-off-1", { groupNumber: 1, cards: [card("Ash", [1800, 3000, 4000])] });
    expect(saved.status).toBe(200);
    // a pilot not in the fly-off has no card there
    expect((await cards(contestId, "fly-off-1", { groupNumber: 1, cards: [card("Eryl", [1800])] })).status).toBe(422);
    expect((await cards(contestId, "fly-off-7", { groupNumber: 1, cards: [card("Ash", [1800])] })).status).toBe(404);
    const keepers = await keepersRoute(json("PUT", { groupNumber: 1, timekeepers: [{ entryId: ids.Bryn, timekeeperUserId: keeper.id }] }), { params: Promise.resolve({ contestId, roundNumber: "fly-off-2" }) });
    expect(keepers.status).toBe(200);
    const duties = await dutiesOf(db, keeper.id);
    expect(duties).toEqual([expect.objectContaining({ contestId, roundNumber: 2, flyOff: true, groupNumber: 1, pilots: [{ entryId: ids.Bryn, name: "Bryn" }] })]);
    expect(duties[0]!.task).toMatchObject({ letter: "A" });
  });

  it("drawing again over a fly-off result is refused unless confirmed; confirmed, the old fly-off results go", async () => {
    actAs(officer);
    const refused = await drawFlyOff(contestId);
    expect(refused.status).toBe(409);
    expect((await refused.json()).error.code).toBe("has_results");
    expect((await flyOffSlots()).filter((s) => s.paperFlights !== null)).toHaveLength(1);
    const confirmed = await drawFlyOff(contestId, { replaceResults: true });
    expect(confirmed.status).toBe(201);
    const slots = await flyOffSlots();
    expect(slots).toHaveLength(12);
    expect(slots.filter((s) => s.paperFlights !== null || s.timekeeperUserId !== null)).toEqual([]);
  });

  it("a fly-off re-flight's result counts as a fly-off result; drawing again, confirmed, takes the re-flight grants with the old draw", async () => {
    actAs(officer);
    const [round1] = await db.select({ id: contestRounds.id }).from(contestRounds)
      .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, true), eq(contestRounds.number, 1)));
    await db.insert(contestReflights).values({ roundId: round1!.id, entryId: ids.Ash!, cause: "launch-collision", placement: "original-group", groupNumber: 1, grantedBy: officer.id, paperFlights: [1500] });
    const refused = await drawFlyOff(contestId);
    expect(refused.status).toBe(409);
    expect((await refused.json()).error.code).toBe("has_results");
    expect(await flyOffReflights()).toHaveLength(1);
    expect((await drawFlyOff(contestId, { replaceResults: true })).status).toBe(201);
    expect(await flyOffReflights()).toEqual([]); // a grant of the old draw would otherwise stand beside the new one
  });

  it("a contest with no fly-off planned: 409; a body the schema refuses: 422", async () => {
    actAs(officer);
    const res = await create(setup({ name: "Fen Cup none" }));
    const plain = ((await res.json()) as { contest: { id: string } }).contest.id;
    expect((await drawFlyOff(plain)).status).toBe(409);
    expect((await drawFlyOff(contestId, { replaceResults: "yes" })).status).toBe(422);
  });

  async function flyOffReflights() {
    return db.select({ id: contestReflights.id }).from(contestReflights).innerJoin(contestRounds, eq(contestRounds.id, contestReflights.roundId))
      .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, true)));
  }

  async function flyOffSlots() {
    return db.select({ entryId: groupSlots.entryId, groupNumber: groupSlots.groupNumber, paperFlights: groupSlots.paperFlights, timekeeperUserId: groupSlots.timekeeperUserId })
      .from(groupSlots).innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
      .where(and(eq(contestRounds.contestId, contestId), eq(contestRounds.isFlyOff, true)));
  }
});
