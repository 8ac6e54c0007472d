import "./support/session";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PUT as decideRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/reflights/records/route";
import { PUT as reflightsRoute } from "@/app/api/contests/[contestId]/rounds/[roundNumber]/reflights/route";
import { GET as resultsRoute } from "@/app/api/contests/[contestId]/results/route";
import { listPendingRecords } from "@/db/queries/contest-records";
import { contestReflights, groupSlots, slotRecords } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks/catalogue";
import { clubContest } from "./support/contest-setup";
import { actAs, type MockSessionUser } from "./support/session";
import { db, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

/**
 * Issue 15: two records for one pilot's re-flight that disagree are both kept and shown side by side for
 * the officer's decision, as for a slot (contest-records.test.ts): a timekeeper's phone run that replaces
 * the grant's paper card, and a paper card entered over the grant's phone run. The decision sets the grant's
 * record (who and when kept); F3K.9.6 still picks which of the original and the re-flight stands. Task A
 * scores the last flight (RULES.md F3K task A); both grants are flown with the original group, where the
 * re-flight stands even when worse (F3K.9.6).
 */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

let officer: MockSessionUser, member: MockSessionUser, keeper: MockSessionUser, stranger: MockSessionUser;
let contestId = "";
let round1 = "";
const ids: Record<string, string> = {};
const grants: Record<string, string> = {};

beforeAll(async () => {
  const made = await clubContest("rr", { club: "Re-flight Records Club", contest: "Re-flight Records Cup", pilots: ["Ada Fenn", "Bo Marsh", "Cy Rook"].map((name) => ({ name })) });
  ({ officer, member, keeper, stranger } = made.cast);
  contestId = made.contestId;
  round1 = made.rounds[0]!;
  Object.assign(ids, made.ids);
  await db.insert(groupSlots).values([
    { roundId: round1, groupNumber: 1, entryId: ids["Ada Fenn"]!, paperFlights: [1500], signedAt: new Date(), signedFrom: "paper card" },
    { roundId: round1, groupNumber: 1, entryId: ids["Bo Marsh"]!, paperFlights: [1000], signedAt: new Date(), signedFrom: "paper card" },
    { roundId: round1, groupNumber: 1, entryId: ids["Cy Rook"]!, paperFlights: [2000], signedAt: new Date(), signedFrom: "paper card" },
  ]);
  const granted = await db.insert(contestReflights).values(["Ada Fenn", "Bo Marsh"].map((n) => ({
    roundId: round1, entryId: ids[n]!, cause: "organiser" as const, placement: "original-group" as const, groupNumber: 1, grantedBy: officer.id,
    timekeeperUserId: keeper.id, timekeeperAssignedBy: officer.id, timekeeperAssignedAt: new Date(),
  }))).returning();
  for (const g of granted) grants[g.entryId === ids["Ada Fenn"] ? "Ada Fenn" : "Bo Marsh"] = g.id;
});

const json = (method: string, body: unknown) => new Request("http://test/api", { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const decide = (body: unknown) => decideRoute(json("PUT", body), { params: Promise.resolve({ contestId, roundNumber: "1" }) });
const card = (name: string, flights: number[]) => reflightsRoute(json("PUT", { entryId: ids[name], flights, runId: null, lane: null, signed: true }), { params: Promise.resolve({ contestId, roundNumber: "1" }) });
const grant = async (name: string) => (await db.select().from(contestReflights).where(eq(contestReflights.id, grants[name]!)))[0]!;
const kept = async (name: string) => db.select().from(slotRecords).where(eq(slotRecords.reflightId, grants[name]!)).orderBy(slotRecords.keptAt);

/** The keeper's phone times `name`'s re-flight (the duty's run: RunEntity.contest.reflightId), `secs` once, and both sign on the phone. */
async function timeReflight(name: string, secs: number) {
  actAs(keeper);
  const phone = recorder(deviceId());
  const s = session(keeper.id);
  const r = { ...run(s.id, [{ lane: 0, pilotName: name }], getCatalogueTask("A")), contest: { roundId: round1, slots: [{ lane: 0, entryId: ids[name]! }], reflightId: grants[name]! } };
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [
    phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [secs], T0 + 1000), phone.at(r.id, T0 + 400_000, { kind: "signed", lane: 0 }),
  ] });
  expect(res.status).toBe(200);
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return r.id;
}

type Cell = { resultTenths: number | null; undecided: boolean; reflight: { stands: string; originalTenths: number; reflightTenths: number } | null };
async function cell(name: string): Promise<Cell> {
  actAs(member);
  const body = (await (await resultsRoute(new Request("http://test/api?format=json"), { params: Promise.resolve({ contestId }) })).json()) as { standings: { pilots: { name: string; rounds: Cell[] }[] } };
  return body.standings.pilots.find((p) => p.name === name)!.rounds[0]!;
}

describe("both records of a re-flight are kept", () => {
  it("a paper card, then the timekeeper's phone run: the run becomes the grant's record, the card waits beside it (undecided on the results)", async () => {
    actAs(officer);
    expect((await card("Bo Marsh", [900])).status).toBe(200);
    expect(await kept("Bo Marsh")).toEqual([]);
    const runId = await timeReflight("Bo Marsh", 80);
    expect(await grant("Bo Marsh")).toMatchObject({ runId, lane: 0, paperFlights: null, recordedBy: keeper.id });
    expect(await kept("Bo Marsh")).toEqual([expect.objectContaining({ slotId: null, paperFlights: [900], runId: null, recordedBy: officer.id, signedFrom: "marked by an officer", outcome: null })]);
    // the run counts until decided: 80.0 s stands over the original 100.0 s (original group, F3K.9.6)
    expect(await cell("Bo Marsh")).toMatchObject({ resultTenths: 800, undecided: true, reflight: { stands: "reflight", originalTenths: 1000, reflightTenths: 800 } });
    const pending = (await listPendingRecords(db, round1)).find((p) => p.entryId === ids["Bo Marsh"] && p.reflight)!;
    expect(pending).toMatchObject({ groupNumber: 1, runId, runResultTenths: 800, recordedBy: keeper.name, others: [expect.objectContaining({ paperFlights: [900], recordedBy: officer.name })] });
    expect(pending.runFlights).toEqual([expect.objectContaining({ timeTenths: 800 })]);
    // the slot's own records are untouched
    expect((await listPendingRecords(db, round1)).some((p) => !p.reflight)).toBe(false);
  });

  it("a phone run, then a paper card: the card becomes the grant's record and the run waits beside it (kept once)", async () => {
    const runId = await timeReflight("Ada Fenn", 120);
    expect(await grant("Ada Fenn")).toMatchObject({ runId, signedFrom: `on the phone: pilot Ada Fenn, timekeeper ${keeper.name}` });
    expect(await kept("Ada Fenn")).toEqual([]);
    actAs(officer);
    expect((await card("Ada Fenn", [1300])).status).toBe(200);
    expect((await card("Ada Fenn", [1300])).status).toBe(200); // saved again: the run is not kept twice
    expect(await grant("Ada Fenn")).toMatchObject({ runId: null, paperFlights: [1300], recordedBy: officer.id });
    expect(await kept("Ada Fenn")).toEqual([expect.objectContaining({ runId, lane: 0, recordedBy: keeper.id, signedFrom: `on the phone: pilot Ada Fenn, timekeeper ${keeper.name}`, outcome: null })]);
    expect(await cell("Ada Fenn")).toMatchObject({ resultTenths: 1300, undecided: true, reflight: { stands: "reflight", reflightTenths: 1300 } });
  });
});

describe("the officer decides (PUT …/reflights/records)", () => {
  it("401 signed out, 404 not a member, 403 a member; 422 a pilot without a grant or a malformed body; nothing changes", async () => {
    const [rec] = await kept("Bo Marsh");
    actAs(null);
    expect((await decide({ entryId: ids["Bo Marsh"], recordId: rec!.id })).status).toBe(401);
    actAs(stranger);
    expect((await decide({ entryId: ids["Bo Marsh"], recordId: rec!.id })).status).toBe(404);
    actAs(member);
    expect((await decide({ entryId: ids["Bo Marsh"], recordId: rec!.id })).status).toBe(403);
    actAs(officer);
    expect((await decide({ entryId: ids["Cy Rook"], recordId: null })).status).toBe(422);
    expect((await decide({ entryId: "not-an-id", recordId: rec!.id })).status).toBe(422);
    expect((await decide({ entryId: ids["Bo Marsh"], recordId: 7 })).status).toBe(422);
    expect(await kept("Bo Marsh")).toEqual([expect.objectContaining({ id: rec!.id, outcome: null, decidedBy: null })]);
    expect((await grant("Bo Marsh")).paperFlights).toBeNull();
  });

  it("a record of another grant (a stale page) is 409; nothing changes", async () => {
    const [adas] = await kept("Ada Fenn");
    actAs(officer);
    const res = await decide({ entryId: ids["Bo Marsh"], recordId: adas!.id });
    expect(res.status).toBe(409);
    expect((await kept("Bo Marsh"))[0]).toMatchObject({ outcome: null });
    expect((await kept("Ada Fenn"))[0]).toMatchObject({ outcome: null });
  });

  it("counting the kept paper card makes it the re-flight's result (the standings follow); the replaced run is kept, set aside; who and when", async () => {
    const before = await grant("Bo Marsh");
    const [rec] = await kept("Bo Marsh");
    actAs(officer);
    const res = await decide({ entryId: ids["Bo Marsh"], recordId: rec!.id });
    expect(res.status).toBe(200);
    expect(await grant("Bo Marsh")).toMatchObject({ paperFlights: [900], runId: null, lane: null, recordedBy: officer.id, signedFrom: "marked by an officer" });
    const after = await kept("Bo Marsh");
    expect(after).toHaveLength(2);
    expect(after.find((r) => r.id === rec!.id)).toMatchObject({ outcome: "counted", decidedBy: officer.id });
    expect(after.find((r) => r.id !== rec!.id)).toMatchObject({ outcome: "set-aside", decidedBy: officer.id, runId: before.runId, lane: 0, recordedBy: keeper.id });
    expect(after.every((r) => r.decidedAt instanceof Date)).toBe(true);
    // F3K.9.6 unchanged: the re-flight (now 90.0 s) stands over the original 100.0 s with the original group
    expect(await cell("Bo Marsh")).toMatchObject({ resultTenths: 900, undecided: false, reflight: { stands: "reflight", originalTenths: 1000, reflightTenths: 900 } });
  });

  it("a second decision is 409 (either way), and changes nothing", async () => {
    const [rec] = await kept("Bo Marsh");
    actAs(officer);
    expect((await decide({ entryId: ids["Bo Marsh"], recordId: rec!.id })).status).toBe(409);
    expect((await decide({ entryId: ids["Bo Marsh"], recordId: null })).status).toBe(409);
    expect(await grant("Bo Marsh")).toMatchObject({ paperFlights: [900] });
  });

  it("keeping the counting record (recordId null) sets the run aside; the card stays the result", async () => {
    actAs(officer);
    expect((await decide({ entryId: ids["Ada Fenn"], recordId: null })).status).toBe(200);
    expect(await kept("Ada Fenn")).toEqual([expect.objectContaining({ outcome: "set-aside", decidedBy: officer.id })]);
    expect(await grant("Ada Fenn")).toMatchObject({ paperFlights: [1300] });
    expect(await cell("Ada Fenn")).toMatchObject({ resultTenths: 1300, undecided: false });
    expect(await listPendingRecords(db, round1)).toEqual([]);
  });
});
