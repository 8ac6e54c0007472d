import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { POST as createClubRoute } from "@/app/api/clubs/route";
import { POST as addFieldRoute } from "@/app/api/clubs/[slug]/fields/route";
import { POST as openDayRoute } from "@/app/api/clubs/[slug]/days/route";
import { memberships } from "@/db/schema";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

/** Issue #14: an officer opens a field day at one of the club's fields; nobody else can, and bad input changes nothing. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const json = (body: unknown) =>
  new Request("http://test/api", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const at = (slug: string) => ({ params: Promise.resolve({ slug }) });
const reply = async (res: Response) => ({ status: res.status, body: await res.json() });

async function clubWithField(label: string) {
  const officer = await freshUser(`${label}-officer`);
  actAs(officer);
  const made = await reply(await createClubRoute(json({ name: `Day Club ${label}` })));
  const slug = made.body.club.slug as string;
  const field = await reply(await addFieldRoute(json({ name: "North Meadow" }), at(slug)));
  expect(field.status).toBe(201);
  const clubId = (await db.execute<{ id: string }>(`select id from clubs where slug = '${slug}'`)).rows[0]!.id;
  const member = await freshUser(`${label}-member`);
  await db.insert(memberships).values({ clubId, userId: member.id, role: "member" });
  return { slug, clubId, officer, member, fieldId: field.body.field.id as string };
}

const open = (as: MockSessionUser | null, slug: string, body: unknown) => {
  actAs(as);
  return openDayRoute(json(body), at(slug)).then(reply);
};
const daysOf = async (clubId: string) =>
  (await db.execute<{ day: string }>(`select day::text as day from club_days where club_id = '${clubId}' order by day`)).rows.map((r) => r.day);

describe("POST /api/clubs/[slug]/days", () => {
  it("opens a day once; opening it again returns the same day", async () => {
    const c = await clubWithField("days-open");
    const first = await open(c.officer, c.slug, { fieldId: c.fieldId, day: "2026-06-14" });
    expect(first.status).toBe(201);
    expect(first.body.day).toMatchObject({ fieldId: c.fieldId, fieldName: "North Meadow", day: "2026-06-14", openedBy: c.officer.id });
    const again = await open(c.officer, c.slug, { fieldId: c.fieldId, day: "2026-06-14" });
    expect(again.status).toBe(200);
    expect(again.body.day.id).toBe(first.body.day.id);
    expect(await daysOf(c.clubId)).toEqual(["2026-06-14"]);
  });

  it("answers 401 signed out, 403 to a member, 404 to another club's officer and for another club's field", async () => {
    const c = await clubWithField("days-authz");
    const other = await clubWithField("days-other");
    expect((await open(null, c.slug, { fieldId: c.fieldId, day: "2026-06-15" })).status).toBe(401);
    expect((await open(c.member, c.slug, { fieldId: c.fieldId, day: "2026-06-15" })).status).toBe(403);
    expect((await open(other.officer, c.slug, { fieldId: c.fieldId, day: "2026-06-15" })).status).toBe(404);
    expect((await open(c.officer, c.slug, { fieldId: other.fieldId, day: "2026-06-15" })).status).toBe(404);
    expect(await daysOf(c.clubId)).toEqual([]);
    expect(await daysOf(other.clubId)).toEqual([]);
  });

  it.each([
    ["a day that does not exist", { day: "2026-02-30" }],
    ["a day the date column cannot hold", { day: "99999-01-01" }],
    ["a day in another format", { day: "14/06/2026" }],
    ["a field id that is not an id", { fieldId: "north" }],
  ])("refuses %s with a 422 and writes nothing", async (_label, change) => {
    const c = await clubWithField("days-bad");
    const res = await open(c.officer, c.slug, { fieldId: c.fieldId, day: "2026-06-16", ...change });
    expect(res.status).toBe(422);
    expect(await daysOf(c.clubId)).toEqual([]);
  });
});
