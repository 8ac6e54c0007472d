import "./support/session";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PUT as keepersRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/timekeepers/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { listLinkableLanes } from "@/db/queries/contest-lanes";
import { listContestPenalties } from "@/db/queries/contest-penalties";
import { groupSlots, runs } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { clubContest, lastPage } from "./support/contest-setup";
import { actAs, type MockSessionUser } from "./support/session";
import { db, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * Issue 15, on the day: an officer gives a group's pilots a timekeeper; the timekeeper's pull
 * carries the duty; the run their phone times and pushes is linked to the pilots' slots, so its
 * server result (run_lanes.result_tenths, lib/results runResult) is the round's result.
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser, keeper: MockSessionUser, flyer: MockSessionUser, stranger: MockSessionUser;
let contestId = "";
let clubId = "";
let round1 = "";
const ids: Record<string, string> = {};

beforeAll(async () => {
  // the flyer entered with an account (not a club member): an entered pilot may keep time in a group they do not fly in
  const made = await clubContest("tk", {
    club: "Keepers Club", contest: "Keepers Cup",
    pilots: [{ name: "Ada Fenn", user: "flyer" }, { name: "Bo Marsh" }, { name: "Cy Rook" }, { name: "Di Oakes" }],
  });
  ({ officer, member, keeper, flyer, stranger } = made.cast);
  ({ clubId, contestId } = made);
  round1 = made.rounds[0]!;
  Object.assign(ids, made.ids);
  await db.insert(groupSlots).values([
    { roundId: round1, groupNumber: 1, entryId: ids["Ada Fenn"]! }, { roundId: round1, groupNumber: 1, entryId: ids["Bo Marsh"]! },
    { roundId: round1, groupNumber: 2, entryId: ids["Cy Rook"]! }, { roundId: round1, groupNumber: 2, entryId: ids["Di Oakes"]! },
  ]);
});

const put = (body: unknown) => keepersRoute(
  new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
  { params: Promise.resolve({ contestId, roundNumber: "1" }) },
);
const slot = async (name: string) => (await db.select().from(groupSlots).where(and(eq(groupSlots.roundId, round1), eq(groupSlots.entryId, ids[name]!))))[0]!;


let keeperPhone: ReturnType<typeof recorder> | null = null;

/** `user`'s phone times a window of `task` with lanes for `names`, each flying `secs[i]` seconds once, tied to round 1's slots; returns the run id. */
async function timedWindow(user: MockSessionUser, names: string[], secs: number[], task = getCatalogueTask("A")): Promise<string> {
  actAs(user);
  const phone = recorder(deviceId());
  keeperPhone = phone;
  // the session as the duty card makes it: the contest's club when the duty carries it (a member)
  const duty = ((await lastPage(user.id)).contestDuties ?? []).find((d) => d.roundId === round1);
  const s = session(user.id, duty?.clubId ? { clubId: duty.clubId } : {});
  const r = { ...run(s.id, names.map((pilotName, lane) => ({ lane, pilotName })), task), contest: { roundId: round1, slots: names.map((n, lane) => ({ lane, entryId: ids[n]! })) } };
  const events = [phone.at(r.id, T0, { kind: "window-start" }), ...names.flatMap((_, lane) => phone.flights(r.id, lane, [secs[lane]!], T0 + 1000 + lane * 500))];
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events });
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return r.id;
}

describe("timekeepers per group", () => {
  it("an officer assigns a member to two pilots of group 1, stored with who and when; the timekeeper's pull carries the duty", async () => {
    actAs(officer);
    const res = await put({ groupNumber: 1, timekeepers: [{ entryId: ids["Ada Fenn"], timekeeperUserId: keeper.id }, { entryId: ids["Bo Marsh"], timekeeperUserId: keeper.id }] });
    expect(res.status).toBe(200);
    expect(await slot("Ada Fenn")).toMatchObject({ timekeeperUserId: keeper.id, timekeeperAssignedBy: officer.id });
    expect((await slot("Bo Marsh")).timekeeperAssignedAt).toBeInstanceOf(Date);

    const duties = (await lastPage(keeper.id)).contestDuties ?? [];
    expect(duties).toEqual([expect.objectContaining({
      contestId, clubId, contestName: "Keepers Cup", roundId: round1, roundNumber: 1, groupNumber: 1,
      pilots: [{ entryId: ids["Ada Fenn"], name: "Ada Fenn" }, { entryId: ids["Bo Marsh"], name: "Bo Marsh" }],
    })]);
    expect(duties[0]!.task).toMatchObject({ letter: "A" });
    expect((await lastPage(member.id)).contestDuties).toEqual([]);
  });

  it("refuses a timekeeper who flies in that group, and one who is neither a member nor entered; nothing changes", async () => {
    actAs(officer);
    const flies = await put({ groupNumber: 1, timekeepers: [{ entryId: ids["Bo Marsh"], timekeeperUserId: flyer.id }] });
    expect(flies.status).toBe(422);
    expect(JSON.stringify(await flies.json())).toMatch(/flies in this group/);
    const outsider = await put({ groupNumber: 2, timekeepers: [{ entryId: ids["Cy Rook"], timekeeperUserId: stranger.id }] });
    expect(outsider.status).toBe(422);
    expect((await slot("Bo Marsh")).timekeeperUserId).toBe(keeper.id);
    expect((await slot("Cy Rook")).timekeeperUserId).toBeNull();
    // the entered pilot may keep time in group 2, where they do not fly
    expect((await put({ groupNumber: 2, timekeepers: [{ entryId: ids["Cy Rook"], timekeeperUserId: flyer.id }] })).status).toBe(200);
    // …without the club on the duty: they are not a member, and a push would refuse a session of that club
    const [flyerDuty] = (await lastPage(flyer.id)).contestDuties ?? [];
    expect(flyerDuty).toMatchObject({ groupNumber: 2, pilots: [{ name: "Cy Rook" }] });
    expect(flyerDuty).not.toHaveProperty("clubId");
    // a pilot of another group is not in this one
    expect((await put({ groupNumber: 2, timekeepers: [{ entryId: ids["Ada Fenn"], timekeeperUserId: keeper.id }] })).status).toBe(422);
  });

  it("a member who is not an officer cannot assign", async () => {
    actAs(member);
    expect((await put({ groupNumber: 1, timekeepers: [{ entryId: ids["Ada Fenn"], timekeeperUserId: null }] })).status).toBe(403);
    expect((await slot("Ada Fenn")).timekeeperUserId).toBe(keeper.id);
  });
});

describe("the timekeeper's run becomes the round's result", () => {
  it("links the pushed lanes to the slots; someone else's or a wrong task's run links nothing", async () => {
    // not the assigned timekeeper: ignored
    const othersRun = await timedWindow(member, ["Ada Fenn"], [100]);
    expect((await slot("Ada Fenn")).runId).toBeNull();
    // the round's task is A; a task B window is not this round's
    await timedWindow(keeper, ["Ada Fenn"], [100], getCatalogueTask("B"));
    expect((await slot("Ada Fenn")).runId).toBeNull();

    // Task A, last flight (RULES.md task table: the last flight only, 300 s cap): Ada 120 s, Bo 90 s
    const runId = await timedWindow(keeper, ["Ada Fenn", "Bo Marsh"], [120, 90]);
    expect(await slot("Ada Fenn")).toMatchObject({ runId, lane: 0, recordedBy: keeper.id, signedAt: null });
    expect(await slot("Bo Marsh")).toMatchObject({ runId, lane: 1 });
    expect(othersRun).not.toBe(runId);
    // the duty's session belongs to the club, so the officer can also find and relink the run by hand
    // (offered around the day the run was set up on: the fixtures' phone clock, not today)
    const [created] = await db.select({ at: runs.createdAt }).from(runs).where(eq(runs.id, runId));
    const linkable = await listLinkableLanes(db, { clubId, day: created!.at.toISOString().slice(0, 10), letter: "A" });
    expect(linkable.filter((l) => l.runId === runId).map((l) => l.pilotName)).toEqual(["Ada Fenn", "Bo Marsh"]);

    actAs(member);
    const res = await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) });
    const { standings } = (await res.json()) as { standings: { pilots: { name: string; rounds: { resultTenths: number; source: string; signed: boolean }[] }[] } };
    const ada = standings.pilots.find((p) => p.name === "Ada Fenn")!;
    // the server's derived result of the run's lane, not yet signed (an unsigned result scores zero, F3K.1.2)
    expect(ada.rounds[0]).toMatchObject({ resultTenths: 1200, signed: false });
  });

  it("pilot and timekeeper sign on the phone: the slot is signed with who and when, and the result counts", async () => {
    const [a] = await db.select({ runId: groupSlots.runId }).from(groupSlots).where(and(eq(groupSlots.roundId, round1), eq(groupSlots.entryId, ids["Ada Fenn"]!)));
    const runId = a!.runId!;
    const phone = keeperPhone!;
    // someone else's "signed" event on that run is not the timekeeper's signature
    actAs(member);
    const stranger = recorder(deviceId());
    await push({ deviceId: stranger.id, sessions: [], runs: [], events: [stranger.at(runId, T0 + 400_000, { kind: "signed", lane: 0 })] });
    expect((await slot("Ada Fenn")).signedAt).toBeNull();

    actAs(keeper);
    const res = await push({ deviceId: phone.id, sessions: [], runs: [], events: [phone.at(runId, T0 + 420_000, { kind: "signed", lane: 0 })] });
    expect(res.body.acks.every((x) => x.status === "applied")).toBe(true);
    const ada = await slot("Ada Fenn");
    expect(ada.signedFrom).toBe(`on the phone: pilot Ada Fenn, timekeeper ${keeper.name}`);
    // the recorder's clock is the server's here (θ = 0): signed at the event's time
    expect(ada.signedAt?.getTime()).toBe(T0 + 420_000);
    expect((await slot("Bo Marsh")).signedAt).toBeNull();

    actAs(member);
    const body = (await (await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) })).json()) as {
      standings: { pilots: { name: string; rounds: { resultTenths: number; pointsTenths: number; signed: boolean }[] }[] };
    };
    const round = (name: string) => body.standings.pilots.find((p) => p.name === name)!.rounds[0]!;
    // Ada's signed 120.0 s is group 1's best (1000 points); Bo's unsigned 90.0 s scores zero (F3K.1.2)
    expect(round("Ada Fenn")).toMatchObject({ resultTenths: 1200, signed: true, pointsTenths: 10000 });
    expect(round("Bo Marsh")).toMatchObject({ signed: false, pointsTenths: 0 });
  });

  it("an undo of the signature on the phone takes it off the slot; signing again signs it anew", async () => {
    const [a] = await db.select({ runId: groupSlots.runId }).from(groupSlots).where(and(eq(groupSlots.roundId, round1), eq(groupSlots.entryId, ids["Ada Fenn"]!)));
    const runId = a!.runId!;
    const phone = keeperPhone!;
    actAs(keeper);
    // the signature pushed in the test before is stored; its undo on the phone is a "void" naming it
    const [signedEvent] = (await getPool().query<{ id: string }>(`select id from events where run_id = $1 and body ->> 'kind' = 'signed' and recorded_by = $2`, [runId, keeper.id])).rows;
    expect((await slot("Ada Fenn")).signedAt).not.toBeNull();
    // an undo of a flight (not a signature) leaves the signature alone
    const [flight] = (await getPool().query<{ id: string }>(`select id from events where run_id = $1 and body ->> 'kind' = 'launch' limit 1`, [runId])).rows;
    await push({ deviceId: phone.id, sessions: [], runs: [], events: [phone.at(runId, T0 + 425_000, { kind: "void", targetId: flight!.id })] });
    expect((await slot("Ada Fenn")).signedAt).not.toBeNull();
    const res = await push({ deviceId: phone.id, sessions: [], runs: [], events: [phone.at(runId, T0 + 430_000, { kind: "void", targetId: signedEvent!.id })] });
    expect(res.body.acks.every((x) => x.status === "applied")).toBe(true);
    // F3K.1.2: the result is unsigned again, so it scores zero until pilot and timekeeper sign again
    expect(await slot("Ada Fenn")).toMatchObject({ signedAt: null, signedFrom: null });
    await push({ deviceId: phone.id, sessions: [], runs: [], events: [phone.at(runId, T0 + 440_000, { kind: "signed", lane: 0 })] });
    expect((await slot("Ada Fenn")).signedAt?.getTime()).toBe(T0 + 440_000);
  });

  it("penalties given on the phone reach the round's result, as runResult applies them (F3K.4.3: the highest of one attempt; F3K.10: off the total)", async () => {
    const [a] = await db.select({ runId: groupSlots.runId }).from(groupSlots).where(and(eq(groupSlots.roundId, round1), eq(groupSlots.entryId, ids["Ada Fenn"]!)));
    const runId = a!.runId!;
    const phone = keeperPhone!;
    actAs(keeper);
    const [launch] = (await getPool().query<{ id: string }>(`select id from events where run_id = $1 and body ->> 'kind' = 'launch' and body ->> 'lane' = '0' order by id limit 1`, [runId])).rows;
    // two penalties in one attempt (Ada's launch): 100 (object in a safety area) and 300 (a person in a safety area) → only the 300 counts (F3K.4.3)
    const given = [
      phone.at(runId, T0 + 450_000, { kind: "penalty", lane: 0, points: 100, reason: "Model touched the safety fence", cause: "object-in-safety-area", launchId: launch!.id }),
      phone.at(runId, T0 + 451_000, { kind: "penalty", lane: 0, points: 300, reason: "Model touched a spectator in the safety area", cause: "person-in-safety-area", launchId: launch!.id }),
    ];
    const res = await push({ deviceId: phone.id, sessions: [], runs: [], events: given });
    expect(res.body.acks.every((x) => x.status === "applied")).toBe(true);
    actAs(member);
    const body = (await (await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) })).json()) as {
      standings: { pilots: { name: string; totalTenths: number; penaltyTenths: number; rounds: { pointsTenths: number; penaltyPoints: number; phonePenaltyPoints: number }[] }[] };
    };
    const ada = body.standings.pilots.find((p) => p.name === "Ada Fenn")!;
    expect(ada.rounds[0]).toMatchObject({ penaltyPoints: 300, phonePenaltyPoints: 300 });
    // one round so far, nothing dropped: the total is the round's points less the 300 (F3K.10)
    expect(ada.penaltyTenths).toBe(3000);
    expect(ada.totalTenths).toBe(ada.rounds[0]!.pointsTenths - 3000);
    // each penalty with its cause, size, verdict, who gave it and when (the results page's list)
    const listed = (await listContestPenalties(db, contestId)).filter((p) => p.name === "Ada Fenn");
    expect(listed).toEqual([
      { id: null, entryId: ids["Ada Fenn"], removedBy: null, removedAtMs: null, removedReason: null, roundNumber: 1, isFlyOff: false, name: "Ada Fenn", source: "phone", points: 100, cause: "object-in-safety-area", reason: "Model touched the safety fence",
        applied: false, dropped: "higher-in-same-attempt", givenBy: keeper.name, givenAtMs: T0 + 450_000, eventId: given[0]!.id },
      { id: null, entryId: ids["Ada Fenn"], removedBy: null, removedAtMs: null, removedReason: null, roundNumber: 1, isFlyOff: false, name: "Ada Fenn", source: "phone", points: 300, cause: "person-in-safety-area", reason: "Model touched a spectator in the safety area",
        applied: true, dropped: null, givenBy: keeper.name, givenAtMs: T0 + 451_000, eventId: given[1]!.id },
    ]);
  });
});
