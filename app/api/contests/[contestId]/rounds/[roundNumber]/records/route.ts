// PUT /api/contests/[contestId]/rounds/[roundNumber]/records — an officer decides which of a pilot's two records counts
import { db } from "@/db";
import { decideRecords } from "@/db/queries/contest-records";
import { getRound } from "@/db/queries/contest-results";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { decideRecordsSchema, roundParamsSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/** 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a pilot not drawn in the round, or no such waiting record. */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, decideRecordsSchema);
  const params = roundParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  const round = await getRound(db, { contestId: params.data.contestId, roundNumber: params.data.roundNumber, flyOff: params.data.flyOff });
  if (!round) throw new NotFoundError("No such round.");
  const done = await decideRecords(db, { roundId: round.id, entryId: body.entryId, userId: me.id, recordId: body.recordId });
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if (done === "no_record") throw new ValidationError("No record of this pilot waits for a decision.", []);
  return Response.json({ decided: true }, { headers: { "cache-control": "no-store" } });
});
