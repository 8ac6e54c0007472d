// PUT /api/contests/[contestId]/rounds/[roundNumber]/reflights/timekeeper — an officer names (or removes) the timekeeper whose phone times a re-flight
import { db } from "@/db";
import { setReflightTimekeeper } from "@/db/queries/contest-reflights";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ValidationError } from "@/lib/errors";
import { reflightTimekeeperSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 no re-flight granted to this
 * pilot in the round, or a timekeeper who is not eligible or flies in the group the re-flight is flown in
 * (lib/contests/timekeepers.ts reflightTimekeeperProblem). The timekeeper's next pull carries the duty.
 */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, reflightTimekeeperSchema);
  const { contestId, round } = await requireOfficerRound(context.params);
  const done = await setReflightTimekeeper(db, { contestId, roundId: round.id, entryId: body.entryId, userId: me.id, timekeeperUserId: body.timekeeperUserId });
  if (done === "not_granted") throw new ValidationError("This pilot has no re-flight in this round.", []);
  if (!done.saved) throw new ValidationError(done.problem, []);
  return Response.json({ saved: true }, { headers: { "cache-control": "no-store" } });
});
