import { afterAll, describe, expect, it } from "vitest";
import { and, eq, isNull, ne } from "drizzle-orm";
import { TransactionRollbackError } from "drizzle-orm/errors";
import { changeUser, type UserChangeOutcome } from "@/db/queries/admin-users";
import { adminActions, users } from "@/db/schema";
import type { UserChange } from "@/lib/admin/user-change";
import { db, freshUser, getPool } from "./support/db";

/**
 * The site always keeps an active admin. The test database is shared (the demo admin and other tests'
 * admins exist), so "the last admin" is made inside a transaction that demotes every other admin and is
 * rolled back: nothing outside it ever sees the change.
 */

afterAll(async () => {
  await getPool().end();
});

/** Changes made in turn by the admin `me`, as if `me` were the only active admin; with what they wrote. */
async function asLastAdmin(me: string, steps: [target: string, change: UserChange][]) {
  let seen: { outcomes: UserChangeOutcome["kind"][]; me: typeof users.$inferSelect; audit: number } | undefined;
  await db
    .transaction(async (tx) => {
      await tx.update(users).set({ role: "member" }).where(and(eq(users.role, "admin"), isNull(users.disabledAt), ne(users.id, me)));
      const outcomes: UserChangeOutcome["kind"][] = [];
      for (const [target, change] of steps) outcomes.push((await changeUser(tx, { actorId: me, userId: target, change })).kind);
      const [row] = await tx.select().from(users).where(eq(users.id, me));
      const audit = (await tx.select().from(adminActions).where(eq(adminActions.actorId, me))).length;
      seen = { outcomes, me: row!, audit };
      tx.rollback();
    })
    .catch((error: unknown) => {
      if (!(error instanceof TransactionRollbackError)) throw error;
    });
  return seen!;
}

describe("the last active admin", () => {
  it("cannot demote themself", async () => {
    const me = await freshUser("last-admin-demote", { role: "admin" });
    const seen = await asLastAdmin(me.id, [[me.id, { action: "set-role", role: "member" }]]);
    expect(seen.outcomes).toEqual(["last-admin"]);
    expect(seen.me).toMatchObject({ role: "admin", disabledAt: null, sessionVersion: me.sessionVersion });
    expect(seen.audit).toBe(0);
  });

  it("cannot disable themself", async () => {
    const me = await freshUser("last-admin-disable", { role: "admin" });
    const seen = await asLastAdmin(me.id, [[me.id, { action: "disable" }]]);
    expect(seen.outcomes).toEqual(["last-admin"]);
    expect(seen.me).toMatchObject({ role: "admin", disabledAt: null });
    expect(seen.audit).toBe(0);
  });

  it("may make another account admin first, and then step down", async () => {
    const me = await freshUser("last-admin-promote", { role: "admin" });
    const pilot = await freshUser("last-admin-pilot");
    const seen = await asLastAdmin(me.id, [
      [pilot.id, { action: "set-role", role: "admin" }],
      [me.id, { action: "set-role", role: "member" }],
      [pilot.id, { action: "disable" }],
    ]);
    // the last step would leave no active admin again (the pilot is the only one now)
    expect(seen.outcomes).toEqual(["changed", "changed", "last-admin"]);
    expect(seen.me.role).toBe("member");
    expect(seen.audit).toBe(2);
  });
});
