// PUT /api/contests/[contestId]/rounds/[roundNumber]/records — an officer decides which of a pilot's two records counts
import { db } from "@/db";
import { decideRecords } from "@/db/queries/contest-records";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ValidationError } from "@/lib/errors";
import { decideRecordsSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/** 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a pilot not drawn in the round, or no such waiting record. */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, decideRecordsSchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await decideRecords(db, { roundId: round.id, entryId: body.entryId, userId: me.id, recordId: body.recordId });
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if (done === "no_record") throw new ValidationError("No record of this pilot waits for a decision.", []);
  return Response.json({ decided: true }, { headers: { "cache-control": "no-store" } });
});
