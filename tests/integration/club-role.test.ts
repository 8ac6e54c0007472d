import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { v7 as uuidv7 } from "uuid";
import { clubs, memberships, users } from "@/db/schema";
import { requireClubRole } from "@/lib/auth/session";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { clubScopedRouteFiles } from "./support/route-files";

afterAll(async () => {
  await getPool().end();
});

/** A club with one account per role, and an officer of another club. */
async function club() {
  const tag = uuidv7();
  const [home, away] = await db.insert(clubs).values([{ name: `Home ${tag}`, slug: `home-${tag}` }, { name: `Away ${tag}`, slug: `away-${tag}` }]).returning();
  const person = async (role: "member" | "coach" | "officer", clubId: string, global: "member" | "admin" = "member") => {
    const [u] = await db.insert(users).values({ email: `${role}-${global}-${uuidv7()}@example.com`, name: role, role: global }).returning();
    await db.insert(memberships).values({ clubId, userId: u!.id, role });
    return { id: u!.id, email: u!.email, name: u!.name, role: global };
  };
  return {
    clubId: home!.id,
    slug: home!.slug,
    member: await person("member", home!.id),
    coach: await person("coach", home!.id),
    officer: await person("officer", home!.id),
    otherOfficer: await person("officer", away!.id),
    admin: await person("member", away!.id, "admin"),
  };
}

const statusOf = async (clubId: string, role: "member" | "coach" | "officer") =>
  requireClubRole(clubId, role).then(() => 200, (e: { status?: number }) => e.status ?? 500);

const statusBySlug = async (slug: string, role: "member" | "coach" | "officer") =>
  requireClubRole({ slug }, role).then(() => 200, (e: { status?: number }) => e.status ?? 500);

/** Route files under a club path that act on no existing club, each with the reason. */
const NOT_CLUB_SCOPED: Record<string, string> = {
  "app/api/clubs/route.ts": "creates a club: none exists yet, and its creator becomes its first officer",
};

describe("requireClubRole, the guard of every club-scoped route", () => {
  it("401 signed out; 404 outside the club (its existence stays hidden); 403 below the role; officers pass coach checks; site admins pass all", async () => {
    const c = await club();
    actAs(null);
    expect(await statusOf(c.clubId, "member")).toBe(401);
    actAs(c.member);
    expect([await statusOf(c.clubId, "member"), await statusOf(c.clubId, "coach")]).toEqual([200, 403]);
    actAs(c.coach);
    expect([await statusOf(c.clubId, "coach"), await statusOf(c.clubId, "officer")]).toEqual([200, 403]);
    actAs(c.officer);
    expect([await statusOf(c.clubId, "coach"), await statusOf(c.clubId, "officer")]).toEqual([200, 200]);
    actAs(c.otherOfficer);
    expect(await statusOf(c.clubId, "member")).toBe(404);
    expect(await statusOf("not-a-club-id", "member")).toBe(404);
    expect(await statusOf(uuidv7(), "member")).toBe(404);
    actAs(c.admin);
    expect(await statusOf(c.clubId, "officer")).toBe(200);
    expect(await statusOf(uuidv7(), "member")).toBe(404);
  });

  it("by address name: the same answers, and a stranger cannot tell a club that exists from one that does not", async () => {
    const c = await club();
    actAs(null);
    expect(await statusBySlug(c.slug, "member")).toBe(401);
    actAs(c.member);
    expect([await statusBySlug(c.slug, "member"), await statusBySlug(c.slug, "officer")]).toEqual([200, 403]);
    actAs(c.officer);
    expect(await statusBySlug(c.slug, "officer")).toBe(200);
    actAs(c.otherOfficer);
    expect([await statusBySlug(c.slug, "member"), await statusBySlug(`no-such-club-${uuidv7()}`, "member")]).toEqual([404, 404]);
    actAs(c.admin);
    expect(await statusBySlug(c.slug, "officer")).toBe(200);
  });

  it("guards every club-scoped route handler on disk (a club in the path, or a clubId read from the request)", () => {
    // GET /api/club-mates and GET /api/club-fields are scoped by the caller's own memberships in their
    // queries: this fails the day a club route is added without the guard.
    const scoped = clubScopedRouteFiles().filter(({ file }) => !(file in NOT_CLUB_SCOPED));
    expect(scoped.length).toBeGreaterThan(0);
    const unguarded = scoped.filter(({ source }) => !/\brequireClubRole\(/.test(source)).map(({ file }) => file);
    expect(unguarded).toEqual([]);
  });
});
