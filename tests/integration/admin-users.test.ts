import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { GET as listUsersRoute } from "@/app/api/admin/users/route";
import { GET as clubMatesRoute } from "@/app/api/club-mates/route";
import { sessionCallbacks } from "@/lib/auth/session-callbacks";
import { actAs } from "./support/session";
import { accountRow } from "./support/authz-actors";
import { auditOf, patchUser } from "./support/admin";
import { freshUser, getPool } from "./support/db";

/** /admin's user changes take effect at the account's very next request, and each leaves an audit entry. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

const canSignIn = (id: string) => sessionCallbacks.signIn!({ user: { id } } as Parameters<NonNullable<typeof sessionCallbacks.signIn>>[0]);
const listUsers = () => listUsersRoute(new Request("http://test/api/admin/users"));

describe("PATCH /api/admin/users/[userId]", () => {
  it("disabling refuses the user's open session at its next request and their sign-in; the audit says who and when", async () => {
    const admin = await freshUser("disabler", { role: "admin" });
    const pilot = await freshUser("disabled-pilot");
    actAs(pilot);
    expect((await clubMatesRoute()).status).toBe(200);

    actAs(admin);
    const before = Date.now();
    const res = await patchUser(pilot.id, { action: "disable" });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ changed: true, user: { id: pilot.id, disabledAt: expect.any(String) } });

    actAs(pilot);
    expect((await clubMatesRoute()).status).toBe(401);
    expect(await canSignIn(pilot.id)).toBe(false);
    const [entry] = await auditOf(pilot.id);
    expect(entry).toMatchObject({ actorId: admin.id, action: "user.disable", targetUserId: pilot.id });
    expect(entry!.createdAt.getTime()).toBeGreaterThanOrEqual(before - 5_000);
  });

  it("re-enabling lets the user sign in again, but brings no session from before the disabling back", async () => {
    const admin = await freshUser("enabler", { role: "admin" });
    const pilot = await freshUser("reenabled-pilot");
    actAs(admin);
    expect((await patchUser(pilot.id, { action: "disable" })).status).toBe(200);
    const res = await patchUser(pilot.id, { action: "enable" });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ changed: true, user: { disabledAt: null } });

    expect(await canSignIn(pilot.id)).toBe(true);
    actAs(pilot); // the token issued before the disabling
    expect((await clubMatesRoute()).status).toBe(401);
    const now = await accountRow(pilot.id);
    actAs({ ...pilot, sessionVersion: now!.sessionVersion }); // a sign-in after re-enabling
    expect((await clubMatesRoute()).status).toBe(200);
    expect((await auditOf(pilot.id)).map((a) => a.action)).toEqual(["user.disable", "user.enable"]);
  });

  it("a role change is effective at once: a new admin reaches the admin API, a demoted one no longer does", async () => {
    const admin = await freshUser("promoter", { role: "admin" });
    const pilot = await freshUser("promoted-pilot");
    actAs(pilot);
    expect((await listUsers()).status).toBe(403);
    actAs(admin);
    expect((await patchUser(pilot.id, { action: "set-role", role: "admin" })).status).toBe(200);
    actAs(pilot);
    expect((await listUsers()).status).toBe(200);
    actAs(admin);
    expect((await patchUser(pilot.id, { action: "set-role", role: "member" })).status).toBe(200);
    actAs(pilot);
    expect((await listUsers()).status).toBe(403);
    expect((await auditOf(pilot.id)).map((a) => [a.action, a.detail])).toEqual([
      ["user.role", { fromRole: "member", toRole: "admin" }],
      ["user.role", { fromRole: "admin", toRole: "member" }],
    ]);
  });

  it("an admin who demotes themself while another admin remains loses the admin API at their next request", async () => {
    const admin = await freshUser("self-demoter", { role: "admin" });
    actAs(admin);
    expect((await patchUser(admin.id, { action: "set-role", role: "member" })).status).toBe(200);
    expect((await listUsers()).status).toBe(403);
    expect((await auditOf(admin.id))[0]).toMatchObject({ actorId: admin.id, action: "user.role" });
  });

  it("a change to how the account already stands answers changed: false and is not audited", async () => {
    const admin = await freshUser("no-op", { role: "admin" });
    const pilot = await freshUser("no-op-pilot");
    actAs(admin);
    const res = await patchUser(pilot.id, { action: "enable" });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ changed: false });
    expect(await auditOf(pilot.id)).toEqual([]);
  });

  it("bad input is a 4xx that changes nothing; an unknown account is 404", async () => {
    const admin = await freshUser("bad-input", { role: "admin" });
    const pilot = await freshUser("bad-input-pilot");
    actAs(admin);
    expect((await patchUser(pilot.id, { action: "set-role", role: "owner" })).status).toBe(422);
    expect((await patchUser(pilot.id, { action: "disable", role: "x".repeat(100_000) })).status).toBe(413);
    expect((await patchUser("not-a-uuid", { action: "disable" })).status).toBe(404);
    expect((await patchUser(crypto.randomUUID(), { action: "disable" })).status).toBe(404);
    expect((await accountRow(pilot.id))).toMatchObject({ disabledAt: null, role: "member", sessionVersion: pilot.sessionVersion });
    expect(await auditOf(pilot.id)).toEqual([]);
  });

  it("is 401 signed out and 403 for a member, who change nothing", async () => {
    const pilot = await freshUser("target");
    actAs(null);
    expect((await patchUser(pilot.id, { action: "disable" })).status).toBe(401);
    actAs(await freshUser("member"));
    expect((await patchUser(pilot.id, { action: "disable" })).status).toBe(403);
    expect((await accountRow(pilot.id))?.disabledAt).toBeNull();
  });
});
