// PUT /api/contests/[contestId]/rounds/[roundNumber]/reflights/records — an officer decides which of a re-flight grant's two records counts
import { db } from "@/db";
import { decideReflightRecords } from "@/db/queries/contest-records";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, ValidationError } from "@/lib/errors";
import { decideRecordsSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 no re-flight granted to this
 * pilot in the round; 409 `decided` when nothing of the grant waits for a decision (decided already) or the
 * record named is not one of its waiting records (a stale page). The body is the slot decision's (`{ entryId, recordId }`).
 */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, decideRecordsSchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await decideReflightRecords(db, { roundId: round.id, entryId: body.entryId, userId: me.id, recordId: body.recordId });
  if (done === "not_granted") throw new ValidationError("This pilot has no re-flight in this round.", []);
  if (done === "no_record") throw new ConflictError("decided", "This re-flight's records were decided already, or the page is out of date: reload it.");
  return Response.json({ decided: true }, { headers: { "cache-control": "no-store" } });
});
