import "server-only";
import { db } from "@/db";
import { getRound } from "@/db/queries/contest-results";
import { contestClubId } from "@/db/queries/contests";
import { roundParamsSchema } from "@/lib/validations/contest-results";
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

/**
 * A round route's guard (cards, runs, timekeepers, records, re-flights): the round's address parsed
 * (a number or fly-off-N; 404 otherwise), the caller an officer of the contest's club
 * (requireContestRole), and the round found (404 "No such round.").
 */
export async function requireOfficerRound(params: Promise<{ contestId: string; roundNumber: string }>) {
  const parsed = roundParamsSchema.safeParse(await params);
  if (!parsed.success) throw new NotFoundError();
  const { contestId, roundNumber, flyOff } = parsed.data;
  await requireContestRole(contestId, "officer");
  const round = await getRound(db, { contestId, roundNumber, flyOff });
  if (!round) throw new NotFoundError("No such round.");
  return { contestId, round };
}
