// PUT /api/contests/[contestId]/rounds/[roundNumber]/runs — an officer links a timed run's lane to a pilot's slot (or unlinks it)
import { db } from "@/db";
import { linkRun } from "@/db/queries/contest-results";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ValidationError } from "@/lib/errors";
import { linkRunSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a pilot not
 * drawn in the round, or a lane not timed at the club's sessions around the contest day with the
 * round's task. Linking clears the slot's paper card and signature.
 */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, linkRunSchema);
  const { contestId, round } = await requireOfficerRound(context.params);
  const link = body.runId !== null && body.lane !== null ? { runId: body.runId, lane: body.lane } : null;
  const done = await linkRun(db, { contestId: contestId, roundId: round.id, entryId: body.entryId, userId: me.id, link });
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if (done === "no_lane") throw new ValidationError("No such lane among the club's runs of the contest day with this round's task.", []);
  return Response.json({ linked: link !== null }, { headers: { "cache-control": "no-store" } });
});
