import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { POST as createClubRoute } from "@/app/api/clubs/route";
import { DELETE as removeRoute, PATCH as roleRoute } from "@/app/api/clubs/[slug]/members/[userId]/route";
import { POST as addFieldRoute } from "@/app/api/clubs/[slug]/fields/route";
import { DELETE as removeFieldRoute } from "@/app/api/clubs/[slug]/fields/[fieldId]/route";
import { GET as myFieldsRoute } from "@/app/api/club-fields/route";
import { memberships } from "@/db/schema";
import { changeMembership } from "@/db/queries/club-members";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

/** Issue #14: officers remove members and change roles, members leave, and a club never loses its last officer. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const json = (method: string, body?: unknown) =>
  new Request("http://test/api", { method, headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
const at = <P extends Record<string, string>>(params: P) => ({ params: Promise.resolve(params) });
const reply = async (res: Response) => ({ status: res.status, body: await res.json() });

/** A fresh club: its officer (the creator), a coach and a member. */
async function club() {
  const officer = await freshUser("mem-officer");
  actAs(officer);
  const made = await reply(await createClubRoute(json("POST", { name: "Test Members Club" })));
  expect(made.status).toBe(201);
  const slug = made.body.club.slug as string;
  const clubId = (await db.execute<{ id: string }>(`select id from clubs where slug = '${slug}'`)).rows[0]!.id;
  const join = async (label: string, role: "member" | "coach") => {
    const u = await freshUser(label);
    await db.insert(memberships).values({ clubId, userId: u.id, role });
    return u;
  };
  return { slug, officer, coach: await join("mem-coach", "coach"), member: await join("mem-member", "member") };
}

const setRole = (as: MockSessionUser, slug: string, userId: string, role: string) => {
  actAs(as);
  return roleRoute(json("PATCH", { role }), at({ slug, userId })).then(reply);
};
const remove = (as: MockSessionUser, slug: string, userId: string) => {
  actAs(as);
  return removeRoute(json("DELETE"), at({ slug, userId })).then(reply);
};

describe("club memberships", () => {
  it("a new club's address comes from its name and its creator is its officer", async () => {
    const c = await club();
    expect(c.slug).toMatch(/^test-members-club(-\d+)?$/);
    expect((await setRole(c.officer, c.slug, c.member.id, "coach")).status).toBe(200);
  });

  it("the last officer cannot step down or leave; once another officer is named, they can", async () => {
    const c = await club();
    const down = await setRole(c.officer, c.slug, c.officer.id, "member");
    expect(down.status).toBe(409);
    expect(down.body.error.message).toMatch(/at least one officer/);
    const leave = await remove(c.officer, c.slug, c.officer.id);
    expect(leave.status).toBe(409);
    expect(leave.body.error.message).toMatch(/only officer/);
    expect((await setRole(c.officer, c.slug, c.coach.id, "officer")).status).toBe(200);
    expect((await remove(c.officer, c.slug, c.officer.id)).status).toBe(200);
    // the new officer is now the last one
    expect((await setRole(c.coach, c.slug, c.coach.id, "coach")).status).toBe(409);
  });

  it("two officers stepping down at once leave one officer", async () => {
    const c = await club();
    expect((await setRole(c.officer, c.slug, c.coach.id, "officer")).status).toBe(200);
    // the other officer steps down in a transaction still open while this one steps down too
    const clubId = (await db.execute<{ id: string }>(`select id from clubs where slug = '${c.slug}'`)).rows[0]!.id;
    const held = await getPool().connect();
    try {
      await held.query("begin");
      await held.query("select id from clubs where id = $1 for update", [clubId]);
      await held.query("update memberships set role = 'member' where club_id = $1 and user_id = $2", [clubId, c.coach.id]);
      let settled = false;
      const mine = changeMembership(db, { clubId, userId: c.officer.id, role: "member" }).finally(() => (settled = true));
      await new Promise((r) => setTimeout(r, 300));
      expect(settled).toBe(false); // it waits for the other change
      await held.query("commit");
      expect(await mine).toBe("last-officer");
    } finally {
      held.release();
    }
    const officers = await db.execute(`select 1 from memberships where club_id = '${clubId}' and role = 'officer'`);
    expect(officers.rows).toHaveLength(1);
  });

  it("a member leaves; a member cannot remove anyone else or change roles; removing a non-member is 404", async () => {
    const c = await club();
    expect((await remove(c.member, c.slug, c.coach.id)).status).toBe(403);
    expect((await setRole(c.member, c.slug, c.member.id, "officer")).status).toBe(403);
    expect((await remove(c.member, c.slug, c.member.id)).status).toBe(200);
    expect((await remove(c.member, c.slug, c.member.id)).status).toBe(404); // no longer in the club
    expect((await remove(c.officer, c.slug, c.member.id)).status).toBe(404);
    expect((await remove(c.officer, c.slug, c.coach.id)).status).toBe(200);
  });

  it("officers add and remove fields; members read them through /api/club-fields; strangers get 404", async () => {
    const c = await club();
    actAs(c.officer);
    const field = { name: "Test Meadow", latitude: "51.5", longitude: "-1.25", launchDirection: "Launch to the west", safetyAreas: "", localRules: "No flying over the road" };
    const added = await reply(await addFieldRoute(json("POST", field), at({ slug: c.slug })));
    expect(added.status).toBe(201);
    expect((await addFieldRoute(json("POST", field), at({ slug: c.slug }))).status).toBe(409);
    actAs(c.member);
    expect((await addFieldRoute(json("POST", { name: "Other" }), at({ slug: c.slug }))).status).toBe(403);
    const mine = (await reply(await myFieldsRoute())).body.fields as { name: string; localRules: string; safetyAreas: string | null; clubName: string }[];
    expect(mine).toEqual([expect.objectContaining({ name: "Test Meadow", localRules: "No flying over the road", safetyAreas: null, clubName: "Test Members Club" })]);
    const stranger = await freshUser("mem-stranger");
    actAs(stranger);
    expect((await reply(await myFieldsRoute())).body.fields).toEqual([]);
    expect((await removeFieldRoute(json("DELETE"), at({ slug: c.slug, fieldId: added.body.field.id }))).status).toBe(404);
    actAs(c.officer);
    expect((await removeFieldRoute(json("DELETE"), at({ slug: c.slug, fieldId: added.body.field.id }))).status).toBe(200);
    expect((await removeFieldRoute(json("DELETE"), at({ slug: c.slug, fieldId: added.body.field.id }))).status).toBe(404);
  });
});
