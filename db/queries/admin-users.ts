import "server-only";
import { and, eq, isNull, sql } from "drizzle-orm";
import { planUserChange, type UserChange } from "@/lib/admin/user-change";
import type { Database } from "../index";
import { adminActions, users } from "../schema";
import type { AdminUserRow } from "./admin";

export type UserChangeOutcome =
  | { kind: "not-found" }
  | { kind: "last-admin" }
  | { kind: "unchanged"; user: AdminUserRow }
  | { kind: "changed"; user: AdminUserRow };

const adminUserColumns = {
  id: users.id, email: users.email, name: users.name, role: users.role,
  disabledAt: users.disabledAt, emailVerifiedAt: users.emailVerifiedAt, createdAt: users.createdAt,
};

/**
 * Disables, re-enables or changes the site role of an account, as `actorId` (an admin), with its audit
 * entry, in one transaction. Effective at the account's next request: every request reads the account
 * afresh (lib/auth/session.ts); disabling also starts a new session generation, so re-enabling brings
 * no old session back.
 *
 * Never leaves the site without an active admin: every active admin row is locked first, so two admins
 * demoting each other at once cannot both succeed (the second sees the first's change and is refused).
 * Deleted accounts (tombstones) are not found.
 */
export async function changeUser(db: Database, params: { actorId: string; userId: string; change: UserChange }): Promise<UserChangeOutcome> {
  return db.transaction(async (tx) => {
    const activeAdmins = await tx
      .select({ id: users.id })
      .from(users)
      .where(and(eq(users.role, "admin"), isNull(users.disabledAt)))
      .orderBy(users.id)
      .for("update");
    const [target] = await tx
      .select({ role: users.role, disabledAt: users.disabledAt })
      .from(users)
      .where(and(eq(users.id, params.userId), isNull(users.deletedAt)))
      .for("update");
    if (!target) return { kind: "not-found" };
    const plan = planUserChange({ role: target.role, disabled: target.disabledAt !== null }, params.change);
    if (plan.kind === "unchanged") {
      const [user] = await tx.select(adminUserColumns).from(users).where(eq(users.id, params.userId));
      return { kind: "unchanged", user: user! };
    }
    if (plan.removesActiveAdmin && !activeAdmins.some((a) => a.id !== params.userId)) return { kind: "last-admin" };
    const [user] = await tx
      .update(users)
      .set({
        role: plan.next.role,
        disabledAt: plan.next.disabled ? (target.disabledAt ?? sql`now()`) : null,
        ...(plan.endSessions ? { sessionVersion: sql`${users.sessionVersion} + 1` } : {}),
      })
      .where(eq(users.id, params.userId))
      .returning(adminUserColumns);
    await tx.insert(adminActions).values({ actorId: params.actorId, action: plan.audit.action, targetUserId: params.userId, detail: plan.audit.detail });
    return { kind: "changed", user: user! };
  });
}
