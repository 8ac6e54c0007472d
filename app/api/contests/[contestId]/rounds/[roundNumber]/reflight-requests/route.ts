// PUT /api/contests/[contestId]/rounds/[roundNumber]/reflight-requests — an officer grants or dismisses a re-flight asked for on a timekeeper's phone
import { db } from "@/db";
import { decideReflightRequest } from "@/db/queries/contest-reflight-requests";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import { decideReflightRequestSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * 401 signed out, 404 no such contest/round/request or not a member, 403 not an officer; 422 a later group that is
 * not one (as a grant); 409 decided already, or the pilot has a re-flight in this round already. A grant is the
 * officer's decision (F3K.9.6); who and when are kept either way.
 */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, decideReflightRequestSchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await decideReflightRequest(db, { roundId: round.id, userId: me.id, ...body });
  if (done === "no_request") throw new NotFoundError();
  if (done === "decided_already") throw new ConflictError("decided_already", "This request is decided already.");
  if (done === "granted_already") throw new ConflictError("granted_already", "This pilot has a re-flight in this round already: dismiss the request.");
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if (done === "bad_group") throw new ValidationError("A later group is one of this round's groups flying after the pilot's own.", []);
  return Response.json({ decided: done }, { headers: { "cache-control": "no-store" } });
});
