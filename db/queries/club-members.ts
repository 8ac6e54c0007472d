import "server-only";
import { and, eq } from "drizzle-orm";
import { leavesAnOfficer, type ClubRole } from "@/lib/clubs/roles";
import type { Database } from "../index";
import { clubs, memberships } from "../schema";

export type MembershipChange = "ok" | "not-member" | "last-officer";

/**
 * Changes one membership (a new role, or null to remove it) unless the club would be left with no
 * officer. The club's row is locked first, so two officers stepping down at once take turns and the
 * second sees the first's change: a club never loses its last officer.
 */
export async function changeMembership(
  db: Database,
  params: { clubId: string; userId: string; role: ClubRole | null },
): Promise<MembershipChange> {
  return db.transaction(async (tx) => {
    await tx.select({ id: clubs.id }).from(clubs).where(eq(clubs.id, params.clubId)).for("update");
    const rows = await tx.select({ userId: memberships.userId, role: memberships.role }).from(memberships).where(eq(memberships.clubId, params.clubId));
    const target = rows.find((r) => r.userId === params.userId);
    if (!target) return "not-member";
    const officers = rows.filter((r) => r.role === "officer").length;
    if (!leavesAnOfficer(officers, target.role, params.role)) return "last-officer";
    const mine = and(eq(memberships.clubId, params.clubId), eq(memberships.userId, params.userId));
    if (params.role === null) await tx.delete(memberships).where(mine);
    else await tx.update(memberships).set({ role: params.role }).where(mine);
    return "ok";
  });
}
