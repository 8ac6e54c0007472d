// POST /api/contests/[contestId]/rounds/[roundNumber]/disputes — an officer records a dispute about a pilot's result in the round
// PUT  /api/contests/[contestId]/rounds/[roundNumber]/disputes — an officer resolves an open dispute (upheld or rejected, the outcome, the action that carries it out)
import { db } from "@/db";
import { lodgeDispute, resolveDispute } from "@/db/queries/contest-disputes";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { DISPUTE_ACTION_WORDS } from "@/lib/contests/disputes";
import { ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import { lodgeDisputeSchema, resolveDisputeSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/** 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a pilot not drawn in the round, a lodged time in the future or more than 2 days before the contest's day. */
export const POST = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, lodgeDisputeSchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await lodgeDispute(db, { roundId: round.id, userId: me.id, ...body });
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if ("problem" in done) throw new ValidationError(done.problem, [{ path: "lodgedAt", message: done.problem }]);
  return Response.json({ id: done.id }, { status: 201, headers: { "cache-control": "no-store" } });
});

/** 401, 404, 403 as above; 404 no such dispute in this round; 409 resolved already; 422 the action named is not done yet. */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, resolveDisputeSchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await resolveDispute(db, { roundId: round.id, userId: me.id, ...body });
  if (done === "not_found") throw new NotFoundError("No such dispute in this round.");
  if (done === "resolved_already") throw new ConflictError("resolved_already", "This dispute is resolved already.");
  if (done === "no_action") throw new ValidationError(`Carry it out first: ${DISPUTE_ACTION_WORDS[body.action!]} for this pilot in this round.`, []);
  return Response.json({ resolved: true }, { headers: { "cache-control": "no-store" } });
});
