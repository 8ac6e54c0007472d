import "server-only";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import type { ClubRole } from "@/lib/clubs/roles";
import type { Database } from "../index";
import { clubs, invitations, memberships, users } from "../schema";

/**
 * Stores an invitation's hash. An earlier unused invitation of the same address to the same club is
 * retired (its link stops working), so only the newest link counts. Returns false (and stores
 * nothing) when an account with that address is already a member.
 */
export async function createInvitation(
  db: Database,
  input: { clubId: string; email: string; role: ClubRole; tokenHash: string; invitedBy: string; expiresAt: Date },
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [member] = await tx
      .select({ id: memberships.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.clubId, input.clubId), eq(users.email, input.email)));
    if (member) return false;
    await tx.delete(invitations).where(and(eq(invitations.clubId, input.clubId), eq(invitations.email, input.email), isNull(invitations.acceptedAt)));
    await tx.insert(invitations).values(input);
    return true;
  });
}

export type InvitationView = { clubName: string; slug: string; email: string; role: ClubRole; expiresAt: Date; acceptedAt: Date | null };
export type InvitationUse = { status: "ok"; invitation: InvitationView & { id: string; clubId: string } } | { status: "used" | "expired" | "unknown" };

function invitationQuery(db: Database, tokenHash: string) {
  return db
    .select({
      id: invitations.id, clubId: invitations.clubId, clubName: clubs.name, slug: clubs.slug, email: invitations.email,
      role: invitations.role, expiresAt: invitations.expiresAt, acceptedAt: invitations.acceptedAt,
    })
    .from(invitations)
    .innerJoin(clubs, eq(clubs.id, invitations.clubId))
    .where(eq(invitations.tokenHash, tokenHash))
    .$dynamic();
}

function judge(row: (InvitationView & { id: string; clubId: string }) | undefined): InvitationUse {
  if (!row) return { status: "unknown" };
  if (row.acceptedAt) return { status: "used" };
  if (row.expiresAt.getTime() <= Date.now()) return { status: "expired" };
  return { status: "ok", invitation: row };
}

/** What following the link would answer now, without using it (the invitation page shows the club). */
export async function peekInvitation(db: Database, tokenHash: string): Promise<InvitationUse> {
  const [row] = await invitationQuery(db, tokenHash);
  return judge(row);
}

/**
 * Uses an invitation inside `tx`: locks it, checks it and makes `userId` a member with the invited
 * role, all in one transaction, so of two uses at once exactly one joins. "member" when the account
 * is already in the club (the link stays unused then).
 */
export async function takeInvitation(tx: Database, params: { tokenHash: string; userId: string }): Promise<InvitationUse | { status: "member" }> {
  const [row] = await invitationQuery(tx, params.tokenHash).for("update", { of: invitations });
  const use = judge(row);
  if (use.status !== "ok") return use;
  const joined = await tx
    .insert(memberships)
    .values({ clubId: use.invitation.clubId, userId: params.userId, role: use.invitation.role })
    .onConflictDoNothing()
    .returning({ id: memberships.id });
  if (joined.length === 0) return { status: "member" };
  await tx.update(invitations).set({ acceptedAt: sql`now()`, acceptedBy: params.userId }).where(eq(invitations.id, use.invitation.id));
  return use;
}

export type PendingInvitation = { id: string; email: string; role: ClubRole; expiresAt: Date };

/** Invitations of the club not yet used and not expired, newest first (for its officers). */
export async function listPendingInvitations(db: Database, clubId: string): Promise<PendingInvitation[]> {
  return db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(eq(invitations.clubId, clubId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, sql`now()`)))
    .orderBy(desc(invitations.createdAt));
}

/**
 * An officer withdraws an invitation not yet used: its row goes, as when a newer invitation retires
 * it, so its link answers "not valid" from then on. False when the club has no such unused invitation.
 */
export async function withdrawInvitation(db: Database, params: { clubId: string; invitationId: string }): Promise<boolean> {
  const gone = await db
    .delete(invitations)
    .where(and(eq(invitations.id, params.invitationId), eq(invitations.clubId, params.clubId), isNull(invitations.acceptedAt)))
    .returning({ id: invitations.id });
  return gone.length > 0;
}
