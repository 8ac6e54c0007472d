import "./support/session";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PUT as decideRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/reflight-requests/route";
import { PUT as keeperRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/reflights/timekeeper/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { contestReflights, groupSlots } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { clubContest, lastPage } from "./support/contest-setup";
import { actAs, type MockSessionUser } from "./support/session";
import { db, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * Issue 15: a timekeeper's phone times a re-flight (F3K.9.6). The officer names the grant's timekeeper
 * (same rules as a group's: eligible, not flying in the group the re-flight is flown in); the pull
 * carries a re-flight duty; the pushed lane becomes the grant's result (not the slot's), only for the
 * grant's timekeeper and the round's task; the phone's signature signs the re-flight (F3K.1.2); the
 * standings pick which result stands as for any re-flight (lib/scoring/reflight.ts).
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser, keeper: MockSessionUser, flyer: MockSessionUser, stranger: MockSessionUser;
let contestId = "";
let round1 = "";
let grantId = "";
const ids: Record<string, string> = {};

beforeAll(async () => {
  const made = await clubContest("rd", {
    club: "Re-flight Duty Club", contest: "Re-flight Duty Cup", pilots: [{ name: "Ada Fenn", user: "flyer" }, { name: "Bo Marsh" }, { name: "Cy Rook" }],
  });
  ({ officer, member, keeper, flyer, stranger } = made.cast);
  contestId = made.contestId;
  round1 = made.rounds[0]!;
  Object.assign(ids, made.ids);
  // group 1: Ada and Bo; Bo's first flight, a signed paper card of 100.0 s (task A: the last flight)
  await db.insert(groupSlots).values([
    { roundId: round1, groupNumber: 1, entryId: ids["Ada Fenn"]!, paperFlights: [1500], signedAt: new Date(), signedFrom: "paper card" },
    { roundId: round1, groupNumber: 1, entryId: ids["Bo Marsh"]!, paperFlights: [1000], signedAt: new Date(), signedFrom: "paper card" },
    { roundId: round1, groupNumber: 2, entryId: ids["Cy Rook"]! },
  ]);
  // Bo re-flies with the original group at the end of the round: the re-flight's result stands even if worse (F3K.9.6)
  const [g] = await db.insert(contestReflights).values({ roundId: round1, entryId: ids["Bo Marsh"]!, cause: "organiser", placement: "original-group", groupNumber: 1, grantedBy: officer.id }).returning();
  grantId = g!.id;
});

const put = (body: unknown) => keeperRoute(
  new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
  { params: Promise.resolve({ contestId, roundNumber: "1" }) },
);
const grant = async () => (await db.select().from(contestReflights).where(eq(contestReflights.id, grantId)))[0]!;
const boSlot = async () => (await db.select().from(groupSlots).where(and(eq(groupSlots.roundId, round1), eq(groupSlots.entryId, ids["Bo Marsh"]!))))[0]!;


const keeperPhone = recorder(deviceId());

/** `user`'s phone times Bo's re-flight window: one lane, `secs` once; `reflightId` as the duty sets it (undefined: an old phone's shape). */
async function timeReflight(user: MockSessionUser, secs: number, o: { reflightId?: string; task?: Record<string, unknown>; phone?: ReturnType<typeof recorder> } = {}) {
  actAs(user);
  const phone = o.phone ?? recorder(deviceId());
  const duty = ((await lastPage(user.id)).contestDuties ?? []).find((d) => d.reflightId === grantId);
  const s = session(user.id, duty?.clubId ? { clubId: duty.clubId } : {});
  const r = {
    ...run(s.id, [{ lane: 0, pilotName: "Bo Marsh" }], o.task ?? getCatalogueTask("A")),
    contest: { roundId: round1, slots: [{ lane: 0, entryId: ids["Bo Marsh"]! }], ...(o.reflightId ? { reflightId: o.reflightId } : {}) },
  };
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [secs], T0 + 1000)] });
  expect(res.status).toBe(200);
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return r.id;
}

describe("naming a re-flight's timekeeper", () => {
  it("401 signed out, 404 not a member, 403 a member who is not an officer; nothing stored", async () => {
    actAs(null);
    expect((await put({ entryId: ids["Bo Marsh"], timekeeperUserId: keeper.id })).status).toBe(401);
    actAs(stranger);
    expect((await put({ entryId: ids["Bo Marsh"], timekeeperUserId: keeper.id })).status).toBe(404);
    actAs(member);
    expect((await put({ entryId: ids["Bo Marsh"], timekeeperUserId: keeper.id })).status).toBe(403);
    expect((await grant()).timekeeperUserId).toBeNull();
  });

  it("422: a pilot without a grant, a timekeeper flying in the re-flight's group, one who is neither member nor entered, a malformed body", async () => {
    actAs(officer);
    expect((await put({ entryId: ids["Cy Rook"], timekeeperUserId: keeper.id })).status).toBe(422);
    const flies = await put({ entryId: ids["Bo Marsh"], timekeeperUserId: flyer.id }); // Ada flies in group 1
    expect(flies.status).toBe(422);
    expect(JSON.stringify(await flies.json())).toMatch(/flies in the group the re-flight is flown in/);
    expect((await put({ entryId: ids["Bo Marsh"], timekeeperUserId: stranger.id })).status).toBe(422);
    expect((await put({ entryId: "not-an-id", timekeeperUserId: keeper.id })).status).toBe(422);
    expect((await grant()).timekeeperUserId).toBeNull();
  });

  it("an officer names a member, stored with who and when; the timekeeper's pull carries the re-flight duty, others' not", async () => {
    actAs(officer);
    expect((await put({ entryId: ids["Bo Marsh"], timekeeperUserId: keeper.id })).status).toBe(200);
    expect(await grant()).toMatchObject({ timekeeperUserId: keeper.id, timekeeperAssignedBy: officer.id });
    expect((await grant()).timekeeperAssignedAt).toBeInstanceOf(Date);
    const duties = (await lastPage(keeper.id)).contestDuties ?? [];
    expect(duties).toEqual([expect.objectContaining({ contestId, roundId: round1, roundNumber: 1, groupNumber: 1, reflightId: grantId, pilots: [{ entryId: ids["Bo Marsh"], name: "Bo Marsh" }] })]);
    expect((await lastPage(member.id)).contestDuties).toEqual([]);
  });
});

describe("the phone's re-flight run", () => {
  it("links only the grant's timekeeper's run of the round's task, to the grant and not the slot", async () => {
    await timeReflight(member, 70, { reflightId: grantId }); // not the grant's timekeeper
    expect((await grant()).runId).toBeNull();
    await timeReflight(keeper, 70, { reflightId: grantId, task: getCatalogueTask("B") }); // not the round's task
    expect((await grant()).runId).toBeNull();
    await timeReflight(keeper, 70); // the old duty shape (no reflightId): the keeper is not the slot's timekeeper, nothing links
    expect((await grant()).runId).toBeNull();
    expect((await boSlot()).runId).toBeNull();

    const runId = await timeReflight(keeper, 80, { reflightId: grantId, phone: keeperPhone });
    expect(await grant()).toMatchObject({ runId, lane: 0, recordedBy: keeper.id, signedAt: null, paperFlights: null });
    // the slot keeps its own first result
    expect(await boSlot()).toMatchObject({ runId: null, paperFlights: [1000] });
  });

  it("the phone's signature signs the re-flight; the standings let it stand though worse (original group, F3K.9.6)", async () => {
    const runId = (await grant()).runId!;
    actAs(keeper);
    const res = await push({ deviceId: keeperPhone.id, sessions: [], runs: [], events: [keeperPhone.at(runId, T0 + 400_000, { kind: "signed", lane: 0 })] });
    expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
    const g = await grant();
    expect(g.signedFrom).toBe(`on the phone: pilot Bo Marsh, timekeeper ${keeper.name}`);
    expect(g.signedAt?.getTime()).toBe(T0 + 400_000);
    expect((await boSlot()).signedFrom).toBe("paper card");

    actAs(member);
    const body = (await (await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) })).json()) as {
      standings: { pilots: { name: string; rounds: { resultTenths: number; reflight: { stands: string; originalTenths: number; reflightTenths: number } | null }[] }[] };
    };
    const bo = body.standings.pilots.find((p) => p.name === "Bo Marsh")!.rounds[0]!;
    // task A scores the last flight: 80.0 s on the phone against 100.0 s on paper; with the original group the re-flight stands
    expect(bo).toMatchObject({ resultTenths: 800, reflight: { stands: "reflight", originalTenths: 1000, reflightTenths: 800 } });
  });

  it("an undo of the signature on the phone takes it off the re-flight", async () => {
    const runId = (await grant()).runId!;
    const [signedEvent] = (await getPool().query<{ id: string }>(`select id from events where run_id = $1 and body ->> 'kind' = 'signed'`, [runId])).rows;
    actAs(keeper);
    await push({ deviceId: keeperPhone.id, sessions: [], runs: [], events: [keeperPhone.at(runId, T0 + 410_000, { kind: "void", targetId: signedEvent!.id })] });
    expect(await grant()).toMatchObject({ signedAt: null, signedFrom: null });
  });

  it("removing the timekeeper drops the duty from the next pull", async () => {
    actAs(officer);
    expect((await put({ entryId: ids["Bo Marsh"], timekeeperUserId: null })).status).toBe(200);
    expect(await grant()).toMatchObject({ timekeeperUserId: null, timekeeperAssignedBy: null });
    expect((await lastPage(keeper.id)).contestDuties).toEqual([]);
  });
});

describe("a `reflight` ruling on the phone becomes a request the officer decides (F3K.9.6: granting is the contest director's)", () => {
  const decide = (body: unknown) => decideRoute(
    new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
    { params: Promise.resolve({ contestId, roundNumber: "1" }) },
  );
  const requests = async () => (await getPool().query<{ id: string; entry_id: string; cause: string; placement: string; asked_by: string; asked_at: Date; status: string; decided_by: string | null; reflight_id: string | null }>(
    "select * from contest_reflight_requests where round_id = $1 order by asked_at", [round1])).rows;
  let cyRun = "";
  const phone = recorder(deviceId());

  it("the keeper's duty run for Cy with a `reflight` ruling: one request with who and when; a push sent again adds none; someone else's ruling none", async () => {
    await db.update(groupSlots).set({ timekeeperUserId: keeper.id }).where(and(eq(groupSlots.roundId, round1), eq(groupSlots.entryId, ids["Cy Rook"]!)));
    actAs(keeper);
    const s = session(keeper.id);
    const r = { ...run(s.id, [{ lane: 0, pilotName: "Cy Rook" }], getCatalogueTask("A")), contest: { roundId: round1, slots: [{ lane: 0, entryId: ids["Cy Rook"]! }] } };
    cyRun = r.id;
    const ruling = phone.at(r.id, T0 + 5_000, { kind: "reflight", lane: 0, cause: "launch-collision", placement: "later-group", reason: "Hit on launch" });
    const body = { deviceId: phone.id, sessions: [s], runs: [r], events: [phone.at(r.id, T0, { kind: "window-start" }), ruling] };
    expect((await push(body)).status).toBe(200);
    expect(await requests()).toEqual([expect.objectContaining({ entry_id: ids["Cy Rook"], cause: "launch-collision", placement: "later-group", asked_by: keeper.id, status: "open" })]);
    expect((await requests())[0]!.asked_at.getTime()).toBe(T0 + 5_000);
    await push(body);
    expect(await requests()).toHaveLength(1);
    // a member who is not Cy's timekeeper rules on their own run of Cy: no request
    actAs(member);
    const other = recorder(deviceId());
    const s2 = session(member.id);
    const r2 = { ...run(s2.id, [{ lane: 0, pilotName: "Cy Rook" }], getCatalogueTask("A")), contest: { roundId: round1, slots: [{ lane: 0, entryId: ids["Cy Rook"]! }] } };
    await push({ deviceId: other.id, sessions: [s2], runs: [r2], events: [other.at(r2.id, T0 + 6_000, { kind: "reflight", lane: 0, cause: "rain", placement: "original-group" })] });
    expect(await requests()).toHaveLength(1);
  });

  it("the decide route: 401, 404 not a member, 403 a member, 404 an unknown request, 422 a malformed body; nothing changes", async () => {
    const [req] = await requests();
    actAs(null);
    expect((await decide({ requestId: req!.id, decision: "dismiss" })).status).toBe(401);
    actAs(stranger);
    expect((await decide({ requestId: req!.id, decision: "dismiss" })).status).toBe(404);
    actAs(member);
    expect((await decide({ requestId: req!.id, decision: "dismiss" })).status).toBe(403);
    actAs(officer);
    expect((await decide({ requestId: randomUUID(), decision: "dismiss" })).status).toBe(404);
    expect((await decide({ requestId: req!.id, decision: "maybe" })).status).toBe(422);
    expect((await decide({ requestId: req!.id, decision: "grant", placement: "later-group", groupNumber: 1, entitled: true, reason: null })).status).toBe(422); // group 1 flies before Cy's
    expect((await requests())[0]).toMatchObject({ status: "open", decided_by: null });
  });

  it("granting makes the re-flight grant with the phone's cause, who and when; a second decision is 409", async () => {
    const [req] = await requests();
    actAs(officer);
    // Cy flies in group 2, the last: a later group cannot be; the officer grants it with the original group
    const res = await decide({ requestId: req!.id, decision: "grant", placement: "original-group", groupNumber: 2, entitled: true, reason: null });
    expect(res.status).toBe(200);
    const after = (await requests())[0]!;
    expect(after).toMatchObject({ status: "granted", decided_by: officer.id });
    const [g] = await db.select().from(contestReflights).where(eq(contestReflights.id, after.reflight_id!));
    expect(g).toMatchObject({ entryId: ids["Cy Rook"], cause: "launch-collision", placement: "original-group", groupNumber: 2, grantedBy: officer.id, reason: "Hit on launch" });
    expect((await decide({ requestId: req!.id, decision: "dismiss" })).status).toBe(409);
  });

  it("dismissing keeps who and when and grants nothing", async () => {
    actAs(keeper);
    await push({ deviceId: phone.id, sessions: [], runs: [], events: [phone.at(cyRun, T0 + 9_000, { kind: "reflight", lane: 0, cause: "rain", placement: "original-group" })] });
    const open = (await requests()).find((r) => r.status === "open")!;
    actAs(officer);
    expect((await decide({ requestId: open.id, decision: "dismiss" })).status).toBe(200);
    expect((await requests()).find((r) => r.id === open.id)).toMatchObject({ status: "dismissed", decided_by: officer.id, reflight_id: null });
  });

  it("an undo of the ruling on the phone withdraws its open request (who and when kept; nothing left to decide); a decided one stays decided", async () => {
    actAs(keeper);
    const ruling = phone.at(cyRun, T0 + 12_000, { kind: "reflight", lane: 0, cause: "rain", placement: "original-group" });
    await push({ deviceId: phone.id, sessions: [], runs: [], events: [ruling] });
    expect((await requests()).find((r) => r.status === "open")).toBeDefined();
    await push({ deviceId: phone.id, sessions: [], runs: [], events: [phone.at(cyRun, T0 + 14_000, { kind: "void", targetId: ruling.id })] });
    const withdrawn = (await requests()).find((r) => r.cause === "rain" && r.asked_at.getTime() === T0 + 12_000)!;
    expect(withdrawn).toMatchObject({ status: "withdrawn", decided_by: keeper.id, reflight_id: null });
    expect((await requests()).filter((r) => r.status === "open")).toHaveLength(0);
    actAs(officer);
    expect((await decide({ requestId: withdrawn.id, decision: "dismiss" })).status).toBe(409);
    // the request granted earlier: undoing its ruling on the phone now leaves the officer's grant as it is
    const granted = (await requests()).find((r) => r.status === "granted")!;
    const [grantedEvent] = (await getPool().query<{ event_id: string }>("select event_id from contest_reflight_requests where id = $1", [granted.id])).rows;
    actAs(keeper);
    await push({ deviceId: phone.id, sessions: [], runs: [], events: [phone.at(cyRun, T0 + 16_000, { kind: "void", targetId: grantedEvent!.event_id })] });
    expect((await requests()).find((r) => r.id === granted.id)).toMatchObject({ status: "granted", decided_by: officer.id });
  });
});
