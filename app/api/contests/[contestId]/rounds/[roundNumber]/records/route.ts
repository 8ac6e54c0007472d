// PUT /api/contests/[contestId]/rounds/[roundNumber]/records — an officer decides which of a pilot's two records counts
import { db } from "@/db";
import { decideRecords } from "@/db/queries/contest-records";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, ValidationError } from "@/lib/errors";
import { decideRecordsSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a pilot not drawn in the round;
 * 409 `decided` when nothing of the pilot's waits for a decision (decided already) or the record named is not one of
 * the waiting ones (a stale page) — as the re-flight grant's decision answers.
 */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, decideRecordsSchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await decideRecords(db, { roundId: round.id, entryId: body.entryId, userId: me.id, recordId: body.recordId });
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if (done === "no_record") throw new ConflictError("decided", "This pilot's records were decided already, or the page is out of date: reload it.");
  return Response.json({ decided: true }, { headers: { "cache-control": "no-store" } });
});
