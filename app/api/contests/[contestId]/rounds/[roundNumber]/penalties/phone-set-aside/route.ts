// POST /api/contests/[contestId]/rounds/[roundNumber]/penalties/phone-set-aside — an officer sets aside a penalty a timekeeper's phone gave (an event in the run: who, when, why)
import { db } from "@/db";
import { setPhonePenaltyAside } from "@/db/queries/contest-phone-set-aside";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { setAsidePhonePenaltySchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * `{ eventId, reason }`. 401 signed out, 404 no such contest/round or not a member, 403 not an officer,
 * 422 a bad body; 404 no such phone penalty on a lane of this round; 201 set aside (the run derived
 * again), 200 the same officer's same set-aside again (a retry adds nothing); 409 `set_aside_already`.
 */
export const POST = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, setAsidePhonePenaltySchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await setPhonePenaltyAside(db, { roundId: round.id, userId: me.id, ...body });
  if (done === "not_found") throw new NotFoundError("No such penalty from a phone in this round.");
  if (done === "set_aside_already") throw new ConflictError("set_aside_already", "This penalty is set aside already.");
  return Response.json({ id: done.id }, { status: done.already ? 200 : 201, headers: { "cache-control": "no-store" } });
});
