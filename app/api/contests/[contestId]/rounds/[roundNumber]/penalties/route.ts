// POST   /api/contests/[contestId]/rounds/[roundNumber]/penalties — an officer gives a pilot of the round a penalty (cause, points, note; who and when kept)
// DELETE /api/contests/[contestId]/rounds/[roundNumber]/penalties — an officer removes an officer's penalty (kept, marked with who, when and why)
import { db } from "@/db";
import { givePenalty, removePenalty } from "@/db/queries/contest-penalties";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import { givePenaltySchema, removePenaltySchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a pilot not drawn
 * in the round; 409 `phone_has_it` when the timekeeper's phone already gave this pilot a counting
 * penalty of this cause in this round (send `separate: true` when it is another one).
 */
export const POST = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, givePenaltySchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await givePenalty(db, { roundId: round.id, userId: me.id, ...body });
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if (done === "phone_has_it") {
    throw new ConflictError("phone_has_it", "The timekeeper's phone already gave this pilot this penalty in this round; it counts once. Tick \"another penalty\" only if it is a different one.");
  }
  return Response.json({ id: done.id }, { status: 201, headers: { "cache-control": "no-store" } });
});

/** 401, 404, 403 as above; 404 no such officer's penalty in this round; 409 removed already. */
export const DELETE = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, removePenaltySchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await removePenalty(db, { roundId: round.id, userId: me.id, ...body });
  if (done === "not_found") throw new NotFoundError("No such penalty in this round.");
  if (done === "removed_already") throw new ConflictError("removed_already", "This penalty is removed already.");
  return Response.json({ removed: true }, { headers: { "cache-control": "no-store" } });
});
