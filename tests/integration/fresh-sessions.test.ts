import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { users } from "@/db/schema";
import { GET as listUsersRoute } from "@/app/api/admin/users/route";
import { GET as clubMatesRoute } from "@/app/api/club-mates/route";
import { bumpSessionVersion } from "@/db/queries/users";
import { getSessionUser } from "@/lib/auth/session";
import { sessionCallbacks } from "@/lib/auth/session-callbacks";
import { actAs } from "./support/session";
import { db, freshUser, getPool } from "./support/db";

afterAll(async () => {
  await getPool().end();
});

// The session token (mocked here at getServerSession) keeps saying who the user was; the account
// in the database decides, on the very next request.
describe("fresh sessions: the account is read on every request", () => {
  it("a deleted account's next request is 401", async () => {
    const pilot = await freshUser("deleted");
    actAs(pilot);
    expect((await clubMatesRoute()).status).toBe(200);
    await db.delete(users).where(eq(users.id, pilot.id));
    expect((await clubMatesRoute()).status).toBe(401);
  });

  it("a disabled account's next request is 401", async () => {
    const pilot = await freshUser("disabled");
    actAs(pilot);
    expect((await clubMatesRoute()).status).toBe(200);
    await db.update(users).set({ disabledAt: new Date() }).where(eq(users.id, pilot.id));
    const res = await clubMatesRoute();
    expect(res.status).toBe(401);
    expect((await res.json()).error.code).toBe("unauthorized");
  });

  it("a demoted admin gets 403 from /api/admin/users on the next request", async () => {
    const admin = await freshUser("demoted", { role: "admin" });
    actAs(admin);
    expect((await listUsersRoute(new Request("http://test/api/admin/users"))).status).toBe(200);
    await db.update(users).set({ role: "member" }).where(eq(users.id, admin.id));
    expect((await listUsersRoute(new Request("http://test/api/admin/users"))).status).toBe(403);
  });

  it("a token from an older session generation is 401; one of the new generation works", async () => {
    const pilot = await freshUser("generation");
    actAs(pilot);
    expect((await clubMatesRoute()).status).toBe(200);
    const next = await bumpSessionVersion(db, pilot.id);
    expect(next).toBe(pilot.sessionVersion + 1);
    expect((await clubMatesRoute()).status).toBe(401);
    actAs({ ...pilot, sessionVersion: next });
    expect((await clubMatesRoute()).status).toBe(200);
  });

  it("server components see a revoked token as signed out, and a renamed account by its new name", async () => {
    const pilot = await freshUser("page");
    actAs(pilot);
    await db.update(users).set({ name: "Renamed Pilot" }).where(eq(users.id, pilot.id));
    expect((await getSessionUser())?.name).toBe("Renamed Pilot");
    await bumpSessionVersion(db, pilot.id);
    expect(await getSessionUser()).toBeNull();
  });

  it("a token naming something that is not an account id is signed out, not a 500", async () => {
    actAs({ id: "not-a-uuid", email: "x@example.com", name: "X", role: "admin" });
    expect((await listUsersRoute(new Request("http://test/api/admin/users"))).status).toBe(401);
  });
});

// next-auth's own session check (getServerSession, /api/auth/session) goes through the jwt callback.
describe("next-auth jwt callback", () => {
  const jwt = (token: Record<string, unknown>, user?: { id: string }) =>
    sessionCallbacks.jwt!({ token, user, account: null } as unknown as Parameters<NonNullable<typeof sessionCallbacks.jwt>>[0]);

  it("stamps the generation at sign-in, refreshes the role, and refuses the token once the generation moves", async () => {
    const pilot = await freshUser("jwt");
    const token = await jwt({}, { id: pilot.id });
    expect(token).toMatchObject({ uid: pilot.id, sv: pilot.sessionVersion, role: "member" });
    await db.update(users).set({ role: "admin" }).where(eq(users.id, pilot.id));
    expect((await jwt({ ...token })).role).toBe("admin");
    await bumpSessionVersion(db, pilot.id);
    await expect(jwt({ ...token })).rejects.toThrow("session_revoked");
  });

  it("refuses sign-in for a disabled account and refuses its tokens", async () => {
    const pilot = await freshUser("jwt-disabled");
    const token = await jwt({}, { id: pilot.id });
    expect(await sessionCallbacks.signIn!({ user: { id: pilot.id } } as never)).toBe(true);
    await db.update(users).set({ disabledAt: new Date() }).where(eq(users.id, pilot.id));
    expect(await sessionCallbacks.signIn!({ user: { id: pilot.id } } as never)).toBe(false);
    await expect(jwt({ ...token })).rejects.toThrow("session_revoked");
  });
});
