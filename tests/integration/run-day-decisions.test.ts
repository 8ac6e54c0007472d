import "./support/session";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PUT as decideRoute } from "@/app/api/clubs/[slug]/days/[date]/decisions/route";
import { GET as decisionsRoute } from "@/app/api/runs/[runId]/day-decisions/route";
import { openClubDay } from "@/db/queries/club-days";
import { clubFields, clubs, memberships } from "@/db/schema";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { addPhone, dayRun, measure, type Phone } from "./support/day-records";

/**
 * Issue #14: the run page says when a club's Day board counts another record for a lane than the run's
 * own result. The day: Pia's run at Beacon Field in "best three of a minute" (60 s cap); her phone
 * 5→60, 62.4→130, 135→180 s = 55.0 + 60.0 + 45.0 = 160.0 s (the conflict rules' pick: more flights);
 * the officer's phone missed the first flight: 60.0 + 45.0 = 105.0 s. Xavi flies lane 1 of the same
 * run and is in no club. The officer (Oren) counts his own phone's record for the day (time zone
 * Pacific/Auckland, so the decision's time is printed on that clock by the page).
 */
const DAY = "2026-09-12";
let slug = "";
let oren: MockSessionUser, pia: MockSessionUser, xavi: MockSessionUser, lone: MockSessionUser, other: MockSessionUser;
let runId = "";
let orensPhone: Phone;

type Answer = { decisions: { clubName: string; clubSlug: string | null; day: string; timeZone: string; lane: number; deviceId: string; recordedByName: string | null; boardResultTenths: number | null; runResultTenths: number | null; decidedByName: string | null; decidedAt: string; note: string }[] };
const read = async (as: MockSessionUser | null, id = runId) => {
  actAs(as);
  const res = await decisionsRoute(new Request("http://test/api"), { params: Promise.resolve({ runId: id }) });
  return { status: res.status, body: (await res.json()) as Answer };
};
const decide = (deviceId: string | null) => {
  actAs(oren);
  return decideRoute(new Request("http://test/api", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify({ runId, lane: 0, deviceId, note: "Pia's first launch was a test throw" }) }), {
    params: Promise.resolve({ slug, date: DAY }),
  });
};

beforeAll(async () => {
  [oren, pia, xavi, lone, other] = (await Promise.all(["rdd-oren", "rdd-pia", "rdd-xavi", "rdd-lone", "rdd-other"].map((l) => freshUser(l)))) as MockSessionUser[] as [MockSessionUser, MockSessionUser, MockSessionUser, MockSessionUser, MockSessionUser];
  slug = `beacon-${Date.now()}`;
  const [club] = await db.insert(clubs).values({ name: "Beacon Field Flyers", slug, timeZone: "Pacific/Auckland" }).returning();
  const [otherClub] = await db.insert(clubs).values({ name: "Far Valley Club", slug: `far-valley-${Date.now()}` }).returning();
  await db.insert(memberships).values([
    { clubId: club!.id, userId: oren.id, role: "officer" },
    { clubId: club!.id, userId: pia.id, role: "member" },
    { clubId: club!.id, userId: lone.id, role: "member" },
    { clubId: otherClub!.id, userId: other.id, role: "officer" },
    { clubId: otherClub!.id, userId: xavi.id, role: "member" },
  ]);
  const [field] = await db.insert(clubFields).values({ clubId: club!.id, name: "Beacon Field" }).returning();
  await openClubDay(db, { clubId: club!.id, fieldId: field!.id, day: DAY, userId: oren.id });
  const piasPhone = await addPhone(pia.id, 0, 40, "rdd-pia");
  orensPhone = await addPhone(oren.id, 0, 40, "rdd-oren");
  const start = `${DAY}T10:00:00+12:00`; // 10:00 in Auckland (NZST, UTC+12 in September before the change)
  await measure(piasPhone, Date.parse(start) - 60_000);
  await measure(orensPhone, Date.parse(start) - 60_000);
  runId = await dayRun({
    creatorId: pia.id, field: "Beacon Field", at: new Date(Date.parse(start)).toISOString(), pilots: [pia.id, xavi.id],
    records: [
      { phone: piasPhone, signals: true, lanes: { 0: [[5, 60], [62.4, 130], [135, 180]], 1: [[10, 40]] } },
      { phone: orensPhone, lanes: { 0: [[62.4, 130], [135, 180]] } },
    ],
  });
});

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

describe("the run page's club-day decisions", () => {
  it("none while no officer counted another record; 401 signed out", async () => {
    expect((await read(null)).status).toBe(401);
    expect((await read(pia)).body).toEqual({ decisions: [] });
    expect((await decide(null)).status).toBe(200); // a note only: the board counts the rules' record
    expect((await read(pia)).body).toEqual({ decisions: [] });
  });

  it("the lane's pilot (a member) reads the club, the day, both results, whose record, who decided and when", async () => {
    const before = Date.now();
    expect((await decide(orensPhone.id)).status).toBe(200);
    const { status, body } = await read(pia);
    expect(status).toBe(200);
    expect(body.decisions).toHaveLength(1);
    const d = body.decisions[0]!;
    expect(d).toMatchObject({
      clubName: "Beacon Field Flyers", clubSlug: slug, day: DAY, timeZone: "Pacific/Auckland", lane: 0, deviceId: orensPhone.id,
      recordedByName: oren.name, boardResultTenths: 1050, runResultTenths: 1600, decidedByName: oren.name, note: "Pia's first launch was a test throw",
    });
    expect(Date.parse(d.decidedAt)).toBeGreaterThanOrEqual(before - 1000);
  });

  it("who else learns of it: the run's members only; not a lane pilot outside the club, not another club, not a member outside the run", async () => {
    expect((await read(xavi)).body).toEqual({ decisions: [] }); // flies lane 1, sees the run, is not a member
    expect((await read(other)).body).toEqual({ decisions: [] });
    expect((await read(lone)).body).toEqual({ decisions: [] }); // a member, but the run is not hers (the board shows it to her)
    expect((await read(oren)).body).toEqual({ decisions: [] }); // the officer who decided is neither its creator nor its pilot
    expect((await read(pia, "not-a-run")).body).toEqual({ decisions: [] });
  });

  it("choosing the record the rules use again: nothing is said otherwise", async () => {
    expect((await decide(null)).status).toBe(200);
    expect((await read(pia)).body).toEqual({ decisions: [] });
  });
});
