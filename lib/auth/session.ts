import "server-only";
import { getServerSession } from "next-auth";
import { db } from "@/db";
import { getSessionAccount, listClubRoles } from "@/db/queries/users";
import { getClubAccess, getClubById, type ClubSummary } from "@/db/queries/clubs";
import { hasClubRole, type ClubRole } from "@/lib/clubs/roles";
import { ForbiddenError, NotFoundError, UnauthorizedError } from "@/lib/errors";
import { isAccountId, sessionVerdict } from "./account-state";
import { authOptions } from "./options";
import { readSessionToken } from "./session-token";

export type SessionUser = { id: string; email: string; name: string; role: "member" | "admin" };
export type { ClubRole };

/**
 * The signed-in user, or null. The account, its name and its role are read from the database on
 * every call (no cache): a deleted, disabled or demoted account, or a token from an older
 * session generation, takes effect on the next request. Server components call this too, so a
 * revoked token is signed out there as well.
 */
export async function getSessionUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  return currentUser(session?.user?.id, session?.user?.sessionVersion);
}

/** The account `id` names, when it exists, is enabled and is still on the token's session generation. */
async function currentUser(id: unknown, sessionVersion: number | undefined): Promise<SessionUser | null> {
  if (!isAccountId(id)) return null;
  const account = await getSessionAccount(db, id);
  if (sessionVerdict(account, sessionVersion) !== "current" || !account) return null;
  return { id: account.id, email: account.email, name: account.name, role: account.role };
}

/**
 * requireUser for the read-only routes a screen calls on every filter change (the Season's): the session
 * cookie decoded once (lib/auth/session-token.ts, next-auth's own decoding and expiry check) and the
 * account read once with the same verdict as getSessionUser (gone, disabled or an older session
 * generation: 401). getServerSession reads the account twice per request (its jwt callback, then
 * getSessionUser) and encrypts a new cookie; this skips both, so these routes do not extend the
 * session's expiry (every page load and /api/auth/session still do). Measured in
 * bench/season.bench.ts (DEVELOPERS.md, "The season endpoint").
 */
export async function requireUserFromToken(): Promise<SessionUser> {
  const token = await readSessionToken();
  const user = await currentUser(token?.uid, token?.sv);
  if (!user) throw new UnauthorizedError();
  return user;
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

export type ClubAccess = SessionUser & { clubId: string; club: ClubSummary; clubRole: ClubRole | null };

/**
 * Requires a role in a club (named by id, or by its address name as in /clubs/[slug]), read fresh
 * from the database. 401 signed out; 404 when the club does not exist or the user is not a member
 * (a stranger must not learn that it exists); 403 for a member below the role. Officers pass coach
 * and member checks; site admins pass every check of a club that exists.
 */
export async function requireClubRole(club: string | { slug: string | null }, role: ClubRole): Promise<ClubAccess> {
  const user = await requireUser();
  const found =
    typeof club === "string" ? await roleById(user.id, club) : club.slug === null ? undefined : await getClubAccess(db, { slug: club.slug, userId: user.id });
  if (!found) throw new NotFoundError();
  const mine = found.role ?? null;
  const access = { ...user, clubId: found.club.id, club: found.club, clubRole: mine };
  if (user.role === "admin") return access;
  if (!mine) throw new NotFoundError();
  if (!hasClubRole(mine, role)) throw new ForbiddenError("Only the club's " + (role === "officer" ? "officers" : "coaches and officers") + " may do this.");
  return access;
}

async function roleById(userId: string, clubId: string) {
  if (!isAccountId(clubId)) return undefined;
  const club = await getClubById(db, clubId);
  if (!club) return undefined;
  const roles = await listClubRoles(db, userId);
  return { club, role: roles.find((r) => r.clubId === clubId)?.role ?? null };
}
