import "./support/session";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as boardRoute } from "@/app/api/clubs/[slug]/days/[date]/route";
import { POST as closeRoute } from "@/app/api/clubs/[slug]/days/[date]/close/route";
import { PUT as decideRoute } from "@/app/api/clubs/[slug]/days/[date]/decisions/route";
import { GET as choicesRoute, PUT as chooseRoute } from "@/app/api/runs/[runId]/club-days/route";
import { sql } from "drizzle-orm";
import { openClubDay } from "@/db/queries/club-days";
import type { DayBoardView } from "@/db/queries/club-day-board";
import { clubFields, clubs, memberships } from "@/db/schema";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { getCatalogueTask } from "@/lib/tasks";
import { addPhone, dayRun, measure, type Phone } from "./support/day-records";

/**
 * Issue #14, the Day board, against numbers worked out by hand. Club "Board Club", field "North
 * Meadow", day Sun 14 June 2026 (UTC); custom task "best three of a minute" (180.0 s max).
 * Phones: p1 (Ada-like P1, θ 0, δ 40 ms), p2 (P2, 15 min slow: θ +900 000, δ 60), p3 (P3, θ 0, δ 20),
 * p10 (P3's second phone, 30 min slow: θ +1 800 000, δ 50), p9 (P3's third, 30 min fast: θ −1 800 000).
 * Each phone's clock is measured once, 60 s before its first tap on the day: its uncertainty there
 * is δ/2 + 15 ppm × 60 s = δ/2 + 0.9 ms (RFC 5905 §8 with its 15 ppm PHI; lib/clock).
 * - R1 10:00 P1 own (p1): flights 5→60, 62.4→130, 135→180 s: 55.0 + 60.0 (67.6 capped) + 45.0 = 160.0; ground 2.4, 5.0 s.
 * - R2 10:20 P1 times P2 (p1), pending: 10→40, 43→100: 30.0 + 57.0 = 87.0; ground 3.0 s.
 * - R3 11:05 P2 own (p2, field written " north  meadow"): 2→22, 25→90: 20.0 + 60.0 (65.0 capped) = 80.0;
 *   ground 3.0 s; p1 also timed it, missing the first flight: 25→90 = 60.0 — recorded differently.
 * - R8 Sat 13 June 15:00 P3 own at "Elsewhere" (p3): 5→50 = 45.0; P3 chooses the day for it.
 * - R10 P3 own (p10), true 00:10 on the 14th (its phone said 23:40 on the 13th): 5→35 = 30.0.
 * - RC Sat 13 June 16:00 P3 own at "Elsewhere" (p3), task C of three attempts (signals at 0, 300, 600 s),
 *   which P3 chooses for the day: 1→5 = 4.0; 310→490 launched 10 s after its signal = 0 (F3K.11 "Task C
 *   details": a launch later than 3 s after the signal scores zero); 601→800 = 199.0, capped at 180.0
 *   (3 min per attempt, from memory; the catalogue's capSec) → 184.0. Its stored ground times are
 *   5.0 s and −189.0 s (each attempt timed from its own signal), neither a turnaround: every flight of
 *   task C waits for a signal (db/queries/season/turnaround.ts, common practice).
 * Left out: R4 (P1 timed P3, who disputed it), R5 (South Field, no day there), R6 (the 15th),
 * R7 (a non-member at North Meadow), R9 (p9, true 23:45 on the 13th though its phone said 00:15 on the 14th).
 */
const DAY = "2026-06-14";
let slug = "";
let board: DayBoardView;
let P1: MockSessionUser, P2: MockSessionUser, P3: MockSessionUser, N: MockSessionUser, outsider: MockSessionUser;
const ids: Record<string, string> = {};
let dayId = "";
let clubId = "";
let southId = "";
let phones = {} as Record<"p1" | "p2" | "p3" | "p9" | "p10" | "pn", Phone>;

const at = (iso: string) => Date.parse(iso);
const json = (method: string, body: unknown) =>
  new Request("http://test/api", { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

async function getBoard(as: MockSessionUser | null, date = DAY, clubSlug = slug) {
  actAs(as);
  const res = await boardRoute(new Request("http://test/api"), { params: Promise.resolve({ slug: clubSlug, date }) });
  return { status: res.status, body: (await res.json()) as DayBoardView };
}

beforeAll(async () => {
  const made = await Promise.all(["day-p1", "day-p2", "day-p3", "day-n", "day-outsider"].map((l) => freshUser(l)));
  [P1, P2, P3, N, outsider] = made as [MockSessionUser, MockSessionUser, MockSessionUser, MockSessionUser, MockSessionUser];
  slug = `board-club-${Date.now()}`;
  const [club] = await db.insert(clubs).values({ name: "Board Club", slug }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: P1.id, role: "officer" },
    { clubId: club!.id, userId: P2.id, role: "member" },
    { clubId: club!.id, userId: P3.id, role: "member" },
  ]);
  const [north, south] = await db.insert(clubFields).values([{ clubId: club!.id, name: "North Meadow" }, { clubId: club!.id, name: "South Field" }]).returning();
  clubId = club!.id;
  southId = south!.id;
  const opened = await openClubDay(db, { clubId: club!.id, fieldId: north!.id, day: DAY, userId: P1.id });
  if (!opened || opened === "closed") throw new Error("the day did not open");
  dayId = opened.day.id;

  phones = {
    p1: await addPhone(P1.id, 0, 40, "p1"), p2: await addPhone(P2.id, 900_000, 60, "p2"), p3: await addPhone(P3.id, 0, 20, "p3"),
    p9: await addPhone(P3.id, -1_800_000, 30, "p9"), p10: await addPhone(P3.id, 1_800_000, 50, "p10"), pn: await addPhone(N.id, 0, 40, "pn"),
  };
  const { p1, p2, p3, p9, p10, pn } = phones;
  await measure(p1, at("2026-06-14T10:00:00Z") - 60_000);
  await measure(p2, at("2026-06-14T11:05:00Z") - 60_000);
  await measure(p10, at("2026-06-14T00:10:00Z") - 60_000);
  await measure(p9, at("2026-06-13T23:45:00Z") - 60_000);

  ids.R1 = await dayRun({ creatorId: P1.id, field: "North Meadow", at: "2026-06-14T10:00:00Z", pilots: [P1.id], records: [{ phone: p1, signals: true, lanes: { 0: [[5, 60], [62.4, 130], [135, 180]] } }] });
  ids.R2 = await dayRun({ creatorId: P1.id, field: "North Meadow", at: "2026-06-14T10:20:00Z", pilots: [P2.id], records: [{ phone: p1, signals: true, lanes: { 0: [[10, 40], [43, 100]] } }] });
  ids.R3 = await dayRun({
    creatorId: P2.id, field: " north  meadow", at: "2026-06-14T11:05:00Z", pilots: [P2.id],
    records: [{ phone: p2, signals: true, lanes: { 0: [[2, 22], [25, 90]] } }, { phone: p1, lanes: { 0: [[25, 90]] } }],
  });
  ids.R4 = await dayRun({ creatorId: P1.id, field: "North Meadow", at: "2026-06-14T12:00:00Z", pilots: [P3.id], records: [{ phone: p1, signals: true, lanes: { 0: [[5, 65]] } }], consent: [{ lane: 0, status: "disputed" }] });
  ids.R5 = await dayRun({ creatorId: P1.id, field: "South Field", at: "2026-06-14T12:30:00Z", pilots: [P1.id], records: [{ phone: p1, signals: true, lanes: { 0: [[5, 65]] } }] });
  ids.R6 = await dayRun({ creatorId: P1.id, field: "North Meadow", at: "2026-06-15T10:00:00Z", pilots: [P1.id], records: [{ phone: p1, signals: true, lanes: { 0: [[5, 65]] } }] });
  ids.R7 = await dayRun({ creatorId: N.id, field: "North Meadow", at: "2026-06-14T10:30:00Z", pilots: [N.id], records: [{ phone: pn, signals: true, lanes: { 0: [[5, 65]] } }] });
  ids.R8 = await dayRun({ creatorId: P3.id, field: "Elsewhere", at: "2026-06-13T15:00:00Z", pilots: [P3.id], records: [{ phone: p3, signals: true, lanes: { 0: [[5, 50]] } }] });
  await measure(p3, at("2026-06-13T15:00:00Z") - 60_000);
  ids.R9 = await dayRun({ creatorId: P3.id, field: "North Meadow", at: "2026-06-13T23:45:00Z", pilots: [P3.id], records: [{ phone: p9, signals: true, lanes: { 0: [[5, 65]] } }] });
  ids.R10 = await dayRun({ creatorId: P3.id, field: "North Meadow", at: "2026-06-14T00:10:00Z", pilots: [P3.id], records: [{ phone: p10, signals: true, lanes: { 0: [[5, 35]] } }] });
  ids.RC = await dayRun({
    creatorId: P3.id, field: "Elsewhere", at: "2026-06-13T16:00:00Z", pilots: [P3.id], task: getCatalogueTask("C", 3),
    records: [{ phone: p3, signals: [0, 300, 600], lanes: { 0: [[1, 5], [310, 490], [601, 800]] } }],
  });

  // P3 chooses the day for R8 and RC from their run pages
  actAs(P3);
  const offered = await choicesRoute(new Request("http://test/api"), { params: Promise.resolve({ runId: ids.R8! }) });
  expect(((await offered.json()) as { days: { dayId: string }[] }).days.map((d) => d.dayId)).toContain(dayId);
  for (const runId of [ids.R8!, ids.RC!]) {
    const chose = await chooseRoute(json("PUT", { dayId, chosen: true }), { params: Promise.resolve({ runId }) });
    expect(chose.status).toBe(200);
  }

  const got = await getBoard(P2);
  expect(got.status).toBe(200);
  board = got.body;
});

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

describe("Day board: which runs belong to the day", () => {
  it("members' runs at the day's field on the day (by corrected start), and the run a pilot chose; in order of start", () => {
    expect(board.runs.map((r) => Object.entries(ids).find(([, id]) => id === r.runId)![0])).toEqual(["R8", "RC", "R10", "R1", "R2", "R3"]);
    expect(board.runs.map((r) => r.startMs)).toEqual(
      ["2026-06-13T15:00:00Z", "2026-06-13T16:00:00Z", "2026-06-14T00:10:00Z", "2026-06-14T10:00:00Z", "2026-06-14T10:20:00Z", "2026-06-14T11:05:00Z"].map(at),
    );
    expect(board.runs.find((r) => r.runId === ids.R3)!.fieldName).toBe("North Meadow");
  });

  it("results are the stored ones (lib/results), pending lanes marked, and the timekeeper named", () => {
    const lanes = Object.fromEntries(board.runs.map((r) => [r.runId, r.lanes[0]!]));
    expect(lanes[ids.R1!]).toMatchObject({ pilotId: P1.id, resultTenths: 1600, pending: false, timedBy: P1.id });
    expect(lanes[ids.R2!]).toMatchObject({ pilotId: P2.id, resultTenths: 870, pending: true, timedBy: P1.id });
    expect(lanes[ids.R3!]).toMatchObject({ pilotId: P2.id, resultTenths: 800, pending: false, timedBy: P2.id });
    expect(lanes[ids.R10!]!.resultTenths).toBe(300);
    expect(lanes[ids.RC!]!.resultTenths).toBe(40 + 0 + 1800);
    expect(lanes[ids.R3!]!.flights.map((f) => [f.launchAtMs, f.landAtMs, f.timeTenths])).toEqual([
      [at("2026-06-14T11:05:02Z"), at("2026-06-14T11:05:22Z"), 200],
      [at("2026-06-14T11:05:25Z"), at("2026-06-14T11:06:30Z"), 650],
    ]);
  });

  it("best results per task, each pilot's best with their number of windows", () => {
    expect(board.best).toEqual([
      { taskCode: "C", rows: [{ pilotId: P3.id, resultTenths: 1840, runId: ids.RC, windows: 1 }] },
      { taskCode: "custom", rows: [
        { pilotId: P1.id, resultTenths: 1600, runId: ids.R1, windows: 1 },
        { pilotId: P2.id, resultTenths: 870, runId: ids.R2, windows: 2 },
        { pilotId: P3.id, resultTenths: 450, runId: ids.R8, windows: 2 },
      ] },
    ]);
  });

  it("flight-time leaders (longest, then total) and turnaround leaders (median ground time)", () => {
    // RC's late launch timed nothing: not a flight here
    expect(board.flightLeaders).toEqual([
      { pilotId: P3.id, longestTenths: 1990, totalTenths: 450 + 300 + 40 + 1990, flights: 4 },
      { pilotId: P1.id, longestTenths: 676, totalTenths: 550 + 676 + 450, flights: 3 },
      { pilotId: P2.id, longestTenths: 650, totalTenths: 300 + 570 + 200 + 650, flights: 4 },
    ]);
    // RC's stored ground times (5.0 s, −189.0 s) are waits for task C's signals: P3 has no turnaround
    expect(board.turnaroundLeaders).toEqual([
      { pilotId: P2.id, medianGroundMs: 3000, turns: 2 },
      { pilotId: P1.id, medianGroundMs: (2400 + 5000) / 2, turns: 2 },
    ]);
  });

  it("who timed whom: only lanes someone else timed", () => {
    expect(board.timed).toEqual([{ timerId: P1.id, pilotId: P2.id, lanes: 1 }]);
  });

  it("runs two phones recorded differently, side by side", () => {
    expect(board.disagreements).toHaveLength(1);
    const d = board.disagreements[0]!;
    expect(d).toMatchObject({ runId: ids.R3, lane: 0, pilotId: P2.id });
    expect(d.versions.map((v) => ({ deviceId: v.deviceId, chosen: v.chosen, resultTenths: v.resultTenths, flights: v.flights }))).toEqual([
      { deviceId: phones.p2.id, chosen: true, resultTenths: 800, flights: 2 },
      { deviceId: phones.p1.id, chosen: false, resultTenths: 600, flights: 1 },
    ]);
  });

  it("each phone's clock offset at its first tap of the day, with its uncertainty δ/2 + 15 ppm × 60 s", () => {
    const clocks = Object.fromEntries(board.clocks.map((c) => [c.deviceId, c]));
    expect(Object.keys(clocks).sort()).toEqual([phones.p1.id, phones.p2.id, phones.p3.id, phones.p10.id].sort());
    expect(clocks[phones.p1.id]!.offsetMs).toBe(0);
    expect(clocks[phones.p1.id]!.uncertaintyMs).toBeCloseTo(20.9, 6);
    expect(clocks[phones.p2.id]!.offsetMs).toBe(900_000);
    expect(clocks[phones.p2.id]!.uncertaintyMs).toBeCloseTo(30.9, 6);
    expect(clocks[phones.p10.id]!.offsetMs).toBe(1_800_000);
    expect(clocks[phones.p10.id]!.uncertaintyMs).toBeCloseTo(25.9, 6);
    expect(clocks[phones.p3.id]!.uncertaintyMs).toBeCloseTo(10.9, 6);
  });

  it("lift timeline: quarter hours of the day from the first flight's to the last's, weighted by each pilot's median", () => {
    // flights launched on the 14th: P1 55.0, 67.6, 45.0 (median 55.0); P2 30.0, 57.0, 20.0, 65.0 (median 43.5); P3 30.0 (median 30.0)
    const lift = board.lift;
    expect(lift).toHaveLength(45); // 00:00 … 11:00
    expect(lift[0]).toMatchObject({ startMs: at("2026-06-14T00:00:00Z"), flights: 1, lift: 0 });
    const bin = (iso: string) => lift.find((b) => b.startMs === at(iso))!;
    expect(bin("2026-06-14T10:00:00Z").flights).toBe(3);
    expect(bin("2026-06-14T10:00:00Z").lift).toBeCloseTo((676 - 550) / 550, 9);
    expect(bin("2026-06-14T10:15:00Z").flights).toBe(2);
    expect(bin("2026-06-14T10:15:00Z").lift).toBeCloseTo((570 - 435) / 435, 9);
    expect(bin("2026-06-14T11:00:00Z")).toMatchObject({ flights: 2, intensity: 1 });
    expect(bin("2026-06-14T11:00:00Z").lift).toBeCloseTo((650 - 435) / 435, 9);
    expect(lift.reduce((n, b) => n + b.flights, 0)).toBe(8);
  });

  it("names only the club's members", () => {
    expect(board.people).toEqual({ [P1.id]: P1.name, [P2.id]: P2.name, [P3.id]: P3.name });
  });
});

describe("Day board: who may see it", () => {
  it("401 signed out; 404 to a non-member, for a date with no day and for a date that is not one", async () => {
    expect((await getBoard(null)).status).toBe(401);
    expect((await getBoard(outsider)).status).toBe(404);
    expect((await getBoard(N)).status).toBe(404);
    expect((await getBoard(P1, "2026-06-15")).status).toBe(404);
    expect((await getBoard(P1, "2026-02-30")).status).toBe(404);
  });

  it("a pilot cannot choose a day for someone else's run, nor a day of a club they are not in", async () => {
    actAs(P2);
    const res = await chooseRoute(json("PUT", { dayId, chosen: true }), { params: Promise.resolve({ runId: ids.R1! }) });
    expect(res.status).toBe(404);
    actAs(N);
    const own = await chooseRoute(json("PUT", { dayId, chosen: true }), { params: Promise.resolve({ runId: ids.R7! }) });
    expect(own.status).toBe(404);
    expect((await getBoard(P1)).body.runs.map((r) => r.runId)).not.toContain(ids.R7);
  });
});

describe("Day board: an officer decides a lane two phones recorded differently", () => {
  const decide = (as: MockSessionUser | null, body: unknown, date = DAY, clubSlug = slug) => {
    actAs(as);
    return decideRoute(json("PUT", body), { params: Promise.resolve({ slug: clubSlug, date }) });
  };

  it("the versions side by side carry each phone's flights on the corrected clock", () => {
    const d = board.disagreements[0]!;
    expect(d.versions.map((v) => v.flightTimes)).toEqual([
      [{ launchAtMs: at("2026-06-14T11:05:02Z"), landAtMs: at("2026-06-14T11:05:22Z") }, { launchAtMs: at("2026-06-14T11:05:25Z"), landAtMs: at("2026-06-14T11:06:30Z") }],
      [{ launchAtMs: at("2026-06-14T11:05:25Z"), landAtMs: at("2026-06-14T11:06:30Z") }],
    ]);
    expect(d.decision).toBeNull();
  });

  it("401 signed out, 404 to a non-member, 403 to a member; bad input and a lane not recorded differently change nothing", async () => {
    const body = { runId: ids.R3, lane: 0, deviceId: phones.p1.id, note: "Ada missed the first launch" };
    expect((await decide(null, body)).status).toBe(401);
    expect((await decide(outsider, body)).status).toBe(404);
    expect((await decide(N, body)).status).toBe(404);
    expect((await decide(P2, body)).status).toBe(403);
    expect((await decide(P1, { ...body, runId: ids.R1 })).status).toBe(404); // one phone only
    expect((await decide(P1, { ...body, lane: 1 })).status).toBe(404);
    expect((await decide(P1, body, "2026-06-15")).status).toBe(404);
    expect((await decide(P1, { ...body, deviceId: phones.p3.id })).status).toBe(422); // did not record it
    expect((await decide(P1, { ...body, deviceId: null, note: "  " })).status).toBe(422); // neither a record nor a note
    expect((await decide(P1, { ...body, note: "x".repeat(501) })).status).toBe(422);
    expect((await decide(P1, { ...body, note: "a\u0000b" })).status).toBe(422);
    expect((await db.execute(sql`select 1 from club_day_decisions where run_id = ${ids.R3}`)).rows).toHaveLength(0);
  });

  it("stored with who and when, shown on the board; a second decision replaces the first", async () => {
    const before = Date.now();
    const first = await decide(P1, { runId: ids.R3, lane: 0, deviceId: phones.p1.id, note: "P2's first launch was a test throw" });
    expect(first.status).toBe(200);
    let got = (await getBoard(P2)).body.disagreements[0]!.decision!;
    expect(got).toMatchObject({ deviceId: phones.p1.id, note: "P2's first launch was a test throw", decidedBy: P1.id });
    expect(Date.parse(got.decidedAt)).toBeGreaterThanOrEqual(before - 1000);
    expect((await decide(P1, { runId: ids.R3, lane: 0, deviceId: null, note: "Ask the pilot" })).status).toBe(200);
    got = (await getBoard(P2)).body.disagreements[0]!.decision!;
    expect(got).toMatchObject({ deviceId: null, note: "Ask the pilot", decidedBy: P1.id });
    expect((await db.execute(sql`select 1 from club_day_decisions where run_id = ${ids.R3}`)).rows).toHaveLength(1);
    // a note only: the board is the conflict rules' again (P2's own record, 80.0)
    const noted = (await getBoard(P2)).body;
    expect(noted.runs.find((r) => r.runId === ids.R3)!.lanes[0]).toMatchObject({ resultTenths: 800, decided: false, timedBy: P2.id });
    expect({ ...noted, disagreements: [] }).toEqual({ ...board, disagreements: [] });
  });

  /**
   * P1's record of R3 (p1 missed the first flight: 25→90 only) chosen for the day, by hand: R3 is 60.0
   * (65.0 capped at 60 s); P2's flights of the day are 30.0, 57.0 (R2) and 65.0 — longest 65.0, total
   * 152.0, three flights; P2's one turnaround is R2's 3.0 s (p1's record of R3 has one flight, no ground
   * time); P1 timed two of P2's lanes. Lift: P2's median becomes 57.0, so the 10:15 quarter (30.0, 57.0)
   * has no lift and the 11:00 quarter (65.0) has (65.0 − 57.0) / 57.0; seven flights on the day.
   * P2's best stays R2's 87.0 (R3 is 60.0 either way below it).
   */
  it("the record that stands is the board's result, leaders, timers and lift (runResult with it chosen); the stored result is left", async () => {
    expect((await decide(P1, { runId: ids.R3, lane: 0, deviceId: phones.p1.id, note: "P2's first launch was a test throw" })).status).toBe(200);
    const b = (await getBoard(P2)).body;
    const lane = b.runs.find((r) => r.runId === ids.R3)!.lanes[0]!;
    expect(lane).toMatchObject({ pilotId: P2.id, resultTenths: 600, decided: true, timedBy: P1.id });
    expect(lane.flights.map((f) => [f.launchAtMs, f.landAtMs, f.timeTenths])).toEqual([[at("2026-06-14T11:05:25Z"), at("2026-06-14T11:06:30Z"), 650]]);
    expect(b.disagreements[0]!.versions.map((v) => [v.deviceId, v.chosen, v.resultTenths])).toEqual([[phones.p1.id, true, 600], [phones.p2.id, false, 800]]);
    expect(b.best.find((t) => t.taskCode === "custom")!.rows.find((r) => r.pilotId === P2.id)).toEqual({ pilotId: P2.id, resultTenths: 870, runId: ids.R2, windows: 2 });
    expect(b.flightLeaders.find((f) => f.pilotId === P2.id)).toEqual({ pilotId: P2.id, longestTenths: 650, totalTenths: 300 + 570 + 650, flights: 3 });
    expect(b.turnaroundLeaders).toEqual([
      { pilotId: P2.id, medianGroundMs: 3000, turns: 1 },
      { pilotId: P1.id, medianGroundMs: (2400 + 5000) / 2, turns: 2 },
    ]);
    expect(b.timed).toEqual([{ timerId: P1.id, pilotId: P2.id, lanes: 2 }]);
    const bin = (iso: string) => b.lift.find((x) => x.startMs === at(iso))!;
    expect(bin("2026-06-14T10:15:00Z")).toMatchObject({ flights: 2, lift: 0 });
    expect(bin("2026-06-14T11:00:00Z").flights).toBe(1);
    expect(bin("2026-06-14T11:00:00Z").lift).toBeCloseTo((650 - 570) / 570, 9);
    expect(b.lift.reduce((n, x) => n + x.flights, 0)).toBe(7);
    // the run's stored result (run page, logbook, Season) stays the conflict rules': the decision is the day's
    const stored = await db.execute<{ result_tenths: number }>(sql`select result_tenths from run_lanes where run_id = ${ids.R3} and lane = 0`);
    expect(stored.rows[0]!.result_tenths).toBe(800);
    // choosing P2's own record (the one the rules use) gives the rules' numbers back, marked as decided
    expect((await decide(P1, { runId: ids.R3, lane: 0, deviceId: phones.p2.id, note: "" })).status).toBe(200);
    const back = (await getBoard(P2)).body;
    expect(back.runs.find((r) => r.runId === ids.R3)!.lanes[0]).toMatchObject({ resultTenths: 800, decided: true, timedBy: P2.id });
    expect(back.flightLeaders).toEqual(board.flightLeaders);
    expect(back.turnaroundLeaders).toEqual(board.turnaroundLeaders);
  });
});

describe("Day board: closing freezes the day", () => {
  it("a run synced after the close does not join, the close mails nobody twice, and the board says who closed it", async () => {
    const before = (await getBoard(P1)).body.runs.map((r) => r.runId);
    actAs(P1);
    const closed = await closeRoute(new Request("http://test/api", { method: "POST" }), { params: Promise.resolve({ slug, date: DAY }) });
    expect(closed.status).toBe(200);
    const after = (await getBoard(P2)).body;
    expect(after.runs.map((r) => r.runId)).toEqual(before);
    expect(after.closedBy).toBe(P1.id);
    expect(after.closedAt).not.toBeNull();

    // P1's phone syncs a run flown at North Meadow that afternoon, after the close
    const late = await dayRun({ creatorId: P1.id, field: "North Meadow", at: "2026-06-14T15:00:00Z", pilots: [P1.id], records: [{ phone: phones.p1, signals: true, lanes: { 0: [[5, 65]] } }] });
    expect((await getBoard(P2)).body.runs.map((r) => r.runId)).toEqual(before);
    // … which the live rules would have taken: the freeze is what keeps it out
    await db.execute(sql`update club_days set runs_frozen_at = null where club_id = ${clubId}`);
    expect((await getBoard(P2)).body.runs.map((r) => r.runId)).toContain(late);
    await db.execute(sql`update club_days set runs_frozen_at = now() where club_id = ${clubId}`);

    // nor can a pilot choose the closed day for it, nor an officer open another field on the date
    actAs(P1);
    expect((await chooseRoute(json("PUT", { dayId, chosen: true }), { params: Promise.resolve({ runId: late }) })).status).toBe(409);
    expect(await openClubDay(db, { clubId, fieldId: southId, day: DAY, userId: P1.id })).toBe("closed");
    actAs(P1);
    const again = await closeRoute(new Request("http://test/api", { method: "POST" }), { params: Promise.resolve({ slug, date: DAY }) });
    expect(((await again.json()) as { summaries: number }).summaries).toBe(0);
    expect((await getBoard(P2)).body.runs.map((r) => r.runId)).toEqual(before);
  });
});
