import "./support/session";
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { PUT as cardsRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/cards/route";
import { DELETE as revokeRoute, POST as publishRoute } from "@/app/api/contests/[contestId]/public-link/route";
import { GET as publicRoute } from "@/app/api/public-results/[token]/route";
import { PUT as linkRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/runs/route";
import { clubs, contestEntries, contestRounds, contests, fieldSessions, groupSlots, memberships, runLanes, runs } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

/**
 * Issue 15, results: an officer enters a group's paper cards; members read the standings (JSON
 * and CSV); the officer's public link shows the same standings without an account until revoked.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser;
let member: MockSessionUser;
let contestId = "";
let clubId = "";
const ids: Record<string, string> = {};

beforeAll(async () => {
  officer = await freshUser("results-officer");
  member = await freshUser("results-member");
  const [club] = await db.insert(clubs).values({ name: "Results Club", slug: `results-${randomUUID().slice(0, 8)}` }).returning();
  clubId = club!.id;
  await db.insert(memberships).values([{ clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: member.id, role: "member" }]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Results Cup", startsOn: "2027-02-13", fieldName: "Mere Field", drawSeed: 5 }).returning();
  contestId = c!.id;
  const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "E"].map((l, i) => ({ contestId, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
  const entries = await db.insert(contestEntries).values(["Una", "Vic", "Wim", "Xia", "Yan", "Zed"].map((pilotName) => ({ contestId, pilotName, paper: true }))).returning();
  for (const e of entries) ids[e.pilotName] = e.id;
  await db.insert(groupSlots).values(entries.flatMap((e, i) => [
    { roundId: rounds[0]!.id, groupNumber: i < 3 ? 1 : 2, entryId: e.id },
    { roundId: rounds[4]!.id, groupNumber: 1, entryId: e.id },
  ]));
});

const put = (body: unknown, roundNumber = "1") =>
  cardsRoute(new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), { params: Promise.resolve({ contestId, roundNumber }) });
const get = (format = "json") => resultsRoute(new Request(`http://test/api?format=${format}`), { params: Promise.resolve({ contestId }) });
const slotsOfRound1 = async () => (await db.select().from(groupSlots).innerJoin(contestRounds, eq(contestRounds.id, groupSlots.roundId))
  .where(eq(contestRounds.contestId, contestId))).filter((r) => r.contest_rounds.number === 1).map((r) => r.group_slots);

describe("paper cards and standings", () => {
  it("an officer enters group 1's cards; members see each group normalised on its own best, the unsigned card at zero", async () => {
    actAs(officer);
    // Task A (last flight, 300 s cap): Una 120.0 then 150.0 → 150.0 s; Vic 180.0 s; Wim 200.0 s but unsigned (F3K.1.2) → 0.
    const g1 = await put({ groupNumber: 1, cards: [
      { entryId: ids.Una, flights: [1200, 1500], penaltyPoints: 100, signed: true },
      { entryId: ids.Vic, flights: [1800], penaltyPoints: 0, signed: true },
      { entryId: ids.Wim, flights: [2000], penaltyPoints: 0, signed: false },
    ] });
    expect(g1.status).toBe(200);
    // Group 2: Xia 350.0 s (capped at 300.0), Yan 240.0 s, Zed 270.0 s.
    expect((await put({ groupNumber: 2, cards: [
      { entryId: ids.Xia, flights: [3500], penaltyPoints: 0, signed: true },
      { entryId: ids.Yan, flights: [2400], penaltyPoints: 0, signed: true },
      { entryId: ids.Zed, flights: [2700], penaltyPoints: 0, signed: true },
    ] })).status).toBe(200);
    const saved = await slotsOfRound1();
    expect(saved.find((s) => s.entryId === ids.Una)).toMatchObject({ paperFlights: [1200, 1500], recordedBy: officer.id, signedFrom: "paper card", penaltyPoints: 100 });
    expect(saved.find((s) => s.entryId === ids.Wim)?.signedAt).toBeNull();

    actAs(member);
    const res = await get();
    expect(res.status).toBe(200);
    const { standings } = (await res.json()) as { standings: { pilots: { name: string; totalTenths: number; rank: number; rounds: { pointsTenths: number }[] }[] } };
    // Hand-computed: Vic 1000; Una 150/180 = 833.3 − 100 penalty = 733.3; Wim 0. Xia 1000; Zed 270/300 = 900.0; Yan 800.0.
    expect(standings.pilots.map((p) => [p.name, p.totalTenths, p.rank])).toEqual([
      ["Vic", 10000, 1], ["Xia", 10000, 1], ["Zed", 9000, 3], ["Yan", 8000, 4], ["Una", 7333, 5], ["Wim", 0, 6],
    ]);
  });

  it("CSV and PDF: the results with every round's points, and every flight with what the task engine counted", async () => {
    actAs(member);
    const results = await get("csv");
    expect(results.headers.get("content-type")).toMatch(/text\/csv/);
    const lines = (await results.text()).split("\r\n");
    expect(lines[0]).toBe("Place,Pilot,Team,Round 1 (A),Penalties,Total,Note,Re-flights");
    expect(lines).toContain("5,Una,,833.3,100.0,733.3,,");
    expect(lines).toContain("6,Wim,,0.0,0.0,0.0,round 1 unsigned,");
    const pdf = await get("pdf");
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    expect(new TextDecoder("latin1").decode(await pdf.arrayBuffer())).toContain("(733.3)");
    const flights = (await (await get("flights-csv")).text()).split("\r\n");
    expect(flights).toHaveLength(1 + 7);
    expect(flights).toContain("1,A,1,Una,paper card,1,120.0,0.0,not-counted,superseded,yes");
    expect(flights).toContain("1,A,2,Xia,paper card,1,350.0,300.0,capped,,yes");
  });

  it("refuses a card for a pilot of another group (422), task E on paper (409), a member (403), and changes nothing", async () => {
    const before = JSON.stringify(await slotsOfRound1());
    actAs(officer);
    expect((await put({ groupNumber: 1, cards: [{ entryId: ids.Xia, flights: [100], penaltyPoints: 0, signed: true }] })).status).toBe(422);
    expect((await put({ groupNumber: 1, cards: [{ entryId: ids.Una, flights: [100], penaltyPoints: 0, signed: true }] }, "5")).status).toBe(409);
    expect((await put({ groupNumber: 1, cards: [{ entryId: ids.Una, flights: [100], penaltyPoints: 0, signed: true }] }, "9")).status).toBe(404);
    expect((await put({ groupNumber: 1, cards: [{ entryId: ids.Una, flights: [-5], penaltyPoints: 0, signed: true }] })).status).toBe(422);
    actAs(member);
    expect((await put({ groupNumber: 1, cards: [{ entryId: ids.Una, flights: [100], penaltyPoints: 0, signed: true }] })).status).toBe(403);
    expect(JSON.stringify(await slotsOfRound1())).toBe(before);
  });
});

describe("the public results link", () => {
  const open = (token: string) => publicRoute(new Request("http://test/api"), { params: Promise.resolve({ token }) });
  const ctx = () => ({ params: Promise.resolve({ contestId }) });

  it("shows the members' standings to anyone until the officer revokes or renews it", async () => {
    actAs(member);
    const members = await (await get()).json();
    actAs(officer);
    const made = await publishRoute(new Request("http://test/api", { method: "POST" }), ctx());
    expect(made.status).toBe(201);
    const { token } = (await made.json()) as { token: string };
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);

    actAs(null);
    const shown = await open(token);
    expect(shown.status).toBe(200);
    expect(await shown.json()).toEqual(members);
    expect((await open(token.replace(/.$/, token.endsWith("A") ? "B" : "A"))).status).toBe(404);
    expect((await open("short")).status).toBe(404);

    actAs(officer);
    const renewed = (await (await publishRoute(new Request("http://test/api", { method: "POST" }), ctx())).json()) as { token: string };
    actAs(null);
    expect((await open(token)).status).toBe(404);
    expect((await open(renewed.token)).status).toBe(200);
    actAs(officer);
    expect((await revokeRoute(new Request("http://test/api", { method: "DELETE" }), ctx())).status).toBe(200);
    actAs(null);
    expect((await open(renewed.token)).status).toBe(404);
  });
});

describe("linking a run a phone timed", () => {
  /** A run of task `letter` at a session of `club` on `at`, one lane for Una with this server result. */
  async function timedRun(p: { club: string | null; at: string; letter: "A" | "B"; resultTenths: number }) {
    const sessionId = randomUUID();
    await db.insert(fieldSessions).values({ id: sessionId, ownerId: officer.id, clubId: p.club, fieldName: "Mere Field", startedAt: new Date(p.at) });
    const runId = randomUUID();
    const task = getCatalogueTask(p.letter);
    await db.insert(runs).values({ id: runId, sessionId, createdBy: officer.id, task, taskCode: p.letter, edition: String(task.edition), createdAt: new Date(p.at) });
    await db.insert(runLanes).values({ runId, lane: 0, pilotName: "Una", resultTenths: p.resultTenths });
    return runId;
  }
  const link = (body: unknown, roundNumber = "1") =>
    linkRoute(new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), { params: Promise.resolve({ contestId, roundNumber }) });
  const una = async () => {
    actAs(member);
    const { standings } = (await (await get()).json()) as { standings: { pilots: { name: string; totalTenths: number; rounds: { resultTenths: number; source: string; signed: boolean }[] }[] } };
    return standings.pilots;
  };

  it("the run's server result becomes the round's result once signed; the wrong club, day or task is refused", async () => {
    const good = await timedRun({ club: clubId, at: "2027-02-13T10:00:00Z", letter: "A", resultTenths: 2950 });
    const otherClub = await timedRun({ club: null, at: "2027-02-13T10:05:00Z", letter: "A", resultTenths: 3000 });
    const otherDay = await timedRun({ club: clubId, at: "2027-02-20T10:00:00Z", letter: "A", resultTenths: 3000 });
    const otherTask = await timedRun({ club: clubId, at: "2027-02-13T10:10:00Z", letter: "B", resultTenths: 2400 });
    actAs(officer);
    for (const runId of [otherClub, otherDay, otherTask]) expect((await link({ entryId: ids.Una, runId, lane: 0 })).status).toBe(422);
    expect((await link({ entryId: ids.Una, runId: good, lane: 1 })).status).toBe(422);
    expect((await link({ entryId: ids.Una, runId: good, lane: null })).status).toBe(422);
    actAs(member);
    expect((await link({ entryId: ids.Una, runId: good, lane: 0 })).status).toBe(403);

    actAs(officer);
    expect((await link({ entryId: ids.Una, runId: good, lane: 0 })).status).toBe(200);
    // linking cleared the paper card and the signature: Una's 295.0 s counts zero until signed (F3K.1.2)
    expect((await una()).find((p) => p.name === "Una")!.rounds[0]).toMatchObject({ resultTenths: 2950, source: "run", signed: false });
    actAs(officer);
    expect((await put({ groupNumber: 1, cards: [{ entryId: ids.Una, flights: null, penaltyPoints: 100, signed: true }] })).status).toBe(200);
    // group 1 now: Una 295.0 s (best, 1000 − 100 penalty = 900.0); Vic 180/295 × 1000 = 610.17 → 610.2; Wim unsigned 0
    const pilots = await una();
    expect(pilots.find((p) => p.name === "Una")!.totalTenths).toBe(9000);
    expect(pilots.find((p) => p.name === "Vic")!.totalTenths).toBe(6102);

    actAs(officer);
    expect((await link({ entryId: ids.Una, runId: null, lane: null })).status).toBe(200);
    expect((await una()).find((p) => p.name === "Una")!.rounds[0]).toMatchObject({ resultTenths: null, source: null });
  });
});
