import "server-only";
import { getServerSession } from "next-auth";
import { db } from "@/db";
import { getSessionAccount, listClubRoles } from "@/db/queries/users";
import { ForbiddenError, UnauthorizedError } from "@/lib/errors";
import { isAccountId, sessionVerdict } from "./account-state";
import { authOptions } from "./options";

export type SessionUser = { id: string; email: string; name: string; role: "member" | "admin" };
export type ClubRole = "member" | "coach" | "officer";

/**
 * The signed-in user, or null. The account, its name and its role are read from the database on
 * every call (no cache): a deleted, disabled or demoted account, or a token from an older
 * session generation, takes effect on the next request. Server components call this too, so a
 * revoked token is signed out there as well.
 */
export async function getSessionUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  const u = session?.user;
  if (!isAccountId(u?.id)) return null;
  const account = await getSessionAccount(db, u.id);
  if (sessionVerdict(account, u.sessionVersion) !== "current" || !account) return null;
  return { id: account.id, email: account.email, name: account.name, role: account.role };
}

/** The signed-in user; throws 401 when signed out. Every route handler calls this (or requireRole). */
export async function requireUser(): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) throw new UnauthorizedError();
  return user;
}

/** Requires a global role (admin). 401 signed out, 403 signed in without the role. */
export async function requireRole(role: "admin"): Promise<SessionUser> {
  const user = await requireUser();
  if (user.role !== role) throw new ForbiddenError();
  return user;
}

const rank: Record<ClubRole, number> = { member: 0, coach: 1, officer: 2 };

/**
 * Requires a role in a club, read fresh from the database. Officers pass coach and member checks;
 * site admins pass every club check.
 */
export async function requireClubRole(clubId: string, role: ClubRole): Promise<SessionUser & { clubRole: ClubRole | null }> {
  const user = await requireUser();
  const roles = await listClubRoles(db, user.id);
  const mine = roles.find((r) => r.clubId === clubId)?.role ?? null;
  if (user.role === "admin") return { ...user, clubRole: mine };
  if (!mine || rank[mine] < rank[role]) throw new ForbiddenError();
  return { ...user, clubRole: mine };
}
