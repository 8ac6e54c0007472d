// PUT /api/contests/[contestId]/rounds/[roundNumber]/runs — an officer links a timed run's lane to a pilot's slot (or unlinks it)
import { db } from "@/db";
import { getRound, linkRun } from "@/db/queries/contest-results";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { linkRunSchema, roundParamsSchema } from "@/lib/validations/contest-results";

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
  const params = roundParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  const round = await getRound(db, { contestId: params.data.contestId, roundNumber: params.data.roundNumber, flyOff: params.data.flyOff });
  if (!round) throw new NotFoundError("No such round.");
  const link = body.runId !== null && body.lane !== null ? { runId: body.runId, lane: body.lane } : null;
  const done = await linkRun(db, { contestId: params.data.contestId, roundId: round.id, entryId: body.entryId, userId: me.id, link });
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if (done === "no_lane") throw new ValidationError("No such lane among the club's runs of the contest day with this round's task.", []);
  return Response.json({ linked: link !== null }, { headers: { "cache-control": "no-store" } });
});
