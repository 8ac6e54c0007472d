import "./support/session";
import { randomBytes, randomUUID } from "node:crypto";
import { and, eq, like } from "drizzle-orm";
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as setAsideRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/penalties/phone-set-aside/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { clubs, contestEntries, contestRounds, contests, events, groupSlots, memberships, runLanes } from "@/db/schema";
import { officerDeviceId, type RunEvent } from "@/lib/events/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { deviceId, pull, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * Issue 15: an officer sets aside a penalty the timekeeper's phone gave. The decision is an event in the
 * run (a server-authored `void` with `setAside`), so runResult derives the lane again: F3K.4.3's "only the
 * highest in one attempt" promotes the next penalty, and F3K.4.1's zero of a launch contact goes (RULES.md
 * "Penalties"). The standings, run_lanes.result_tenths, the penalties CSV and the timekeeper's pull agree.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser, keeper: MockSessionUser, stranger: MockSessionUser;
let contestId = "";
let round1 = "";
let runId = "";
const ids: Record<string, string> = {};
const phone = recorder(deviceId());
let p300: RunEvent, p100: RunEvent, contact: RunEvent, launchWyn: RunEvent;
const today = new Date().toISOString().slice(0, 10);

beforeAll(async () => {
  [officer, member, keeper, stranger] = (await Promise.all(["sa-officer", "sa-member", "sa-keeper", "sa-stranger"].map((l) => freshUser(l)))) as [
    MockSessionUser, MockSessionUser, MockSessionUser, MockSessionUser,
  ];
  const [club] = await db.insert(clubs).values({ name: "Set Aside Club", slug: `set-aside-${randomUUID().slice(0, 8)}` }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: officer.id, role: "officer" }, { clubId: club!.id, userId: member.id, role: "member" }, { clubId: club!.id, userId: keeper.id, role: "member" },
  ]);
  const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Set Aside Cup", startsOn: today, fieldName: "Long Acre", drawSeed: 4, publicToken: randomBytes(32).toString("base64url") }).returning();
  contestId = c!.id;
  const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
  round1 = rounds[0]!.id;
  const entries = await db.insert(contestEntries).values(["Ula Brent", "Vic Sallow", "Wyn Carrow"].map((pilotName) => ({ contestId, pilotName, paper: true }))).returning();
  for (const e of entries) ids[e.pilotName] = e.id;
  // round 1, task A: Ula's card 150.0 s (signed); Wyn and Vic timed on the keeper's phone
  await db.insert(groupSlots).values([
    { roundId: round1, groupNumber: 1, entryId: ids["Ula Brent"]!, paperFlights: [1500], signedAt: new Date(), signedFrom: "paper card" },
    { roundId: round1, groupNumber: 1, entryId: ids["Wyn Carrow"]!, timekeeperUserId: keeper.id },
    { roundId: round1, groupNumber: 1, entryId: ids["Vic Sallow"]!, timekeeperUserId: keeper.id },
  ]);
  // the keeper's phone: Wyn 120.0 s with two penalties in that attempt (300 and 100), Vic 140.0 s with a contact at launch (F3K.4.1)
  actAs(keeper);
  const s = session(keeper.id);
  const r = { ...run(s.id, [{ lane: 0, pilotName: "Wyn Carrow" }, { lane: 1, pilotName: "Vic Sallow" }], getCatalogueTask("A")),
    contest: { roundId: round1, slots: [{ lane: 0, entryId: ids["Wyn Carrow"]! }, { lane: 1, entryId: ids["Vic Sallow"]! }] } };
  runId = r.id;
  const wyn = phone.flights(r.id, 0, [120], T0 + 1000);
  const vic = phone.flights(r.id, 1, [140], T0 + 2000);
  launchWyn = wyn[0]!;
  p300 = phone.at(r.id, T0 + 200_000, { kind: "penalty", lane: 0, points: 300, reason: "Touched a helper in the safety area", cause: "person-in-safety-area", launchId: launchWyn.id });
  p100 = phone.at(r.id, T0 + 200_500, { kind: "penalty", lane: 0, points: 100, reason: "Landed in the safety area", cause: "object-in-safety-area", launchId: launchWyn.id });
  contact = phone.at(r.id, T0 + 201_000, { kind: "penalty", lane: 1, points: 100, reason: "Hit a person at launch", cause: "launch-contact", launchId: vic[0]!.id });
  const pushed = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [
    phone.at(r.id, T0, { kind: "window-start" }), ...wyn, ...vic, p300, p100, contact,
    phone.at(r.id, T0 + 210_000, { kind: "signed", lane: 0 }), phone.at(r.id, T0 + 210_500, { kind: "signed", lane: 1 }),
  ] });
  expect(pushed.body.acks.every((a) => a.status === "applied")).toBe(true);
});

const call = (body: unknown, roundNumber = "1") => setAsideRoute(
  new Request("http://test/api", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
  { params: Promise.resolve({ contestId, roundNumber }) },
);
type Round = { pointsTenths: number | null; penaltyPoints: number; phonePenaltyPoints: number };
async function round1Of(name: string): Promise<Round & { totalTenths: number }> {
  actAs(member);
  const body = (await (await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) })).json()) as {
    standings: { pilots: { name: string; totalTenths: number; rounds: Round[] }[] };
  };
  actAs(officer);
  const p = body.standings.pilots.find((x) => x.name === name)!;
  return { ...p.rounds[0]!, totalTenths: p.totalTenths };
}
const laneResult = async (lane: number) => (await db.select({ result: runLanes.resultTenths }).from(runLanes).where(and(eq(runLanes.runId, runId), eq(runLanes.lane, lane))))[0]!.result;
const officerEvents = () => db.select().from(events).where(and(eq(events.runId, runId), like(events.deviceId, "officer:%")));

describe("an officer sets aside a phone's penalty", () => {
  it("401 signed out, 404 a stranger, 403 a member, 422 a bad body; 404 no such phone penalty in this round; nothing written", async () => {
    const body = { eventId: p300.id, reason: "Wrong pilot" };
    actAs(null);
    expect((await call(body)).status).toBe(401);
    actAs(stranger);
    expect((await call(body)).status).toBe(404);
    actAs(member);
    expect((await call(body)).status).toBe(403);
    actAs(officer);
    expect((await call({ eventId: p300.id, reason: "   " })).status).toBe(422);
    expect((await call({ eventId: "nope", reason: "x" })).status).toBe(422);
    expect((await call({ eventId: p300.id, reason: "x".repeat(201) })).status).toBe(422);
    expect((await call(body, "2")).status).toBe(404); // another round
    expect((await call({ eventId: randomUUID(), reason: "x" })).status).toBe(404);
    expect((await call({ eventId: launchWyn.id, reason: "x" })).status).toBe(404); // not a penalty
    expect(await officerEvents()).toHaveLength(0);
  });

  it("F3K.4.3: the highest of the attempt set aside, the next one counts; once only, a retry adds nothing; the timekeeper's pull carries it", async () => {
    // Wyn: 120/150 × 1000 = 800.0, −300 (only the highest of the attempt, F3K.4.3)
    const before = await round1Of("Wyn Carrow");
    expect(before).toMatchObject({ pointsTenths: 8000, penaltyPoints: 300, phonePenaltyPoints: 300 });
    expect(await laneResult(0)).toBe(1200);
    actAs(keeper);
    const { body: start } = await pull(0);
    const cursor = start.nextCursor as string;

    actAs(officer);
    const res = await call({ eventId: p300.id, reason: "It was the pilot's own helper" });
    expect(res.status).toBe(201);
    const { id } = (await res.json()) as { id: string };
    const after = await round1Of("Wyn Carrow");
    expect(after).toMatchObject({ pointsTenths: 8000, penaltyPoints: 100, phonePenaltyPoints: 100 });
    expect(after.totalTenths - before.totalTenths).toBe(2000);
    const [lane] = await db.select({ derived: runLanes.derived }).from(runLanes).where(and(eq(runLanes.runId, runId), eq(runLanes.lane, 0)));
    expect((lane!.derived as { penalties: { eventId: string; applied: boolean }[] }).penalties.map((p) => [p.eventId, p.applied])).toEqual([[p100.id, true]]);

    // a double click: the same event, nothing added; another reason or officer: 409
    const again = await call({ eventId: p300.id, reason: "It was the pilot's own helper" });
    expect(again.status).toBe(200);
    expect(((await again.json()) as { id: string }).id).toBe(id);
    const other = await call({ eventId: p300.id, reason: "Changed my mind" });
    expect(other.status).toBe(409);
    expect(((await other.json()) as { error: { code: string } }).error.code).toBe("set_aside_already");
    const stored = await officerEvents();
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatchObject({ id, runId, deviceId: officerDeviceId(p300.id), seq: 1, recordedBy: officer.id, kind: "void" });
    expect(stored[0]!.body).toEqual({ kind: "void", targetId: p300.id, setAside: { reason: "It was the pilot's own helper", by: officer.name } });

    // the timekeeper's phone pulls the decision and the run's new results
    actAs(keeper);
    const { body: next } = await pull(cursor);
    const items = next.items as { type: string; data: { id: string; body?: unknown }; results?: { lane: number; penaltyPoints: number }[] }[];
    expect(items.find((i) => i.type === "event" && i.data.id === id)?.data.body).toEqual(stored[0]!.body);
    expect(items.find((i) => i.type === "run" && i.data.id === runId)?.results?.find((l) => l.lane === 0)?.penaltyPoints).toBe(100);
  });

  it("F3K.4.1: a launch contact set aside, the run scores again and the group's best moves", async () => {
    // Vic zeroed (0, −100); Ula's 150.0 s is the group's best (1000.0)
    expect(await round1Of("Vic Sallow")).toMatchObject({ pointsTenths: 0, penaltyPoints: 100 });
    expect(await laneResult(1)).toBe(0);
    expect((await round1Of("Ula Brent")).pointsTenths).toBe(10000);
    expect((await call({ eventId: contact.id, reason: "The model passed above him" })).status).toBe(201);
    // Vic's 140.0 s counts again; Ula's 150.0 s stays the group's best: 140/150 × 1000 = 933.3 (F3K.9.1)
    expect(await laneResult(1)).toBe(1400);
    expect(await round1Of("Vic Sallow")).toMatchObject({ pointsTenths: 9333, penaltyPoints: 0 });
  });

  it("the timekeeper's phone may still undo it (harmless), but cannot undo or forge the officer's decision", async () => {
    const [decision] = (await officerEvents()).filter((e) => (e.body as { targetId: string }).targetId === p300.id);
    actAs(keeper);
    const undo = phone.at(runId, T0 + 300_000, { kind: "void", targetId: p300.id });
    const undoOfficer = phone.at(runId, T0 + 300_500, { kind: "void", targetId: decision!.id });
    const forged = phone.at(runId, T0 + 301_000, { kind: "void", targetId: p100.id, setAside: { reason: "mine" } });
    const res = await push({ deviceId: phone.id, sessions: [], runs: [], events: [undo, undoOfficer, forged] });
    const status = new Map(res.body.acks.map((a) => [a.id, a.status]));
    expect([status.get(undo.id), status.get(undoOfficer.id), status.get(forged.id)]).toEqual(["applied", "rejected", "rejected"]);
    expect((await round1Of("Wyn Carrow")).penaltyPoints).toBe(100);
    // nor push as the officer's device (it would take the key of a later set-aside)
    const squatter = recorder(officerDeviceId(p100.id));
    const squat = await push({ deviceId: squatter.id, sessions: [], runs: [], events: [squatter.at(runId, T0 + 302_000, { kind: "void", targetId: p100.id })] });
    expect(squat.status).toBe(422);
    expect(await officerEvents()).toHaveLength(2);
  });

  it("the penalties CSV lists the set-aside one with who, when and why, not counting", async () => {
    actAs(member);
    const csv = await (await resultsRoute(new Request("http://test/api?format=penalties-csv"), { params: Promise.resolve({ contestId }) })).text();
    const rows = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true }).data.filter((r) => r.Pilot === "Wyn Carrow");
    expect(rows.map((r) => [r.Points, r.Counts, r["Removed by"], r["Why removed"]])).toEqual(expect.arrayContaining([
      ["100", "yes", "", ""],
      ["300", "no: set aside", officer.name, "It was the pilot's own helper"],
    ]));
    expect(rows).toHaveLength(2);
    expect(rows.find((r) => r.Points === "300")!["Removed at"]).toMatch(/\d{2}:\d{2}/);
    actAs(officer);
  });
});
