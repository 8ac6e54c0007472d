import "server-only";
import { db } from "@/db";
import { contestClubId } from "@/db/queries/contests";
import { NotFoundError } from "@/lib/errors";
import type { ClubRole } from "@/lib/clubs/roles";
import { requireClubRole, requireUser } from "./session";

/**
 * A contest route's guard: the caller's role in the contest's club, read fresh (requireClubRole):
 * 401 signed out, 404 no such contest or not a member (a stranger cannot tell), 403 below the role.
 */
export async function requireContestRole(contestId: string, role: ClubRole) {
  await requireUser();
  const clubId = await contestClubId(db, contestId);
  if (!clubId) throw new NotFoundError();
  return requireClubRole(clubId, role);
}
