// POST /api/contests/[contestId]/rounds/[roundNumber]/reflights — an officer grants a pilot a re-flight (F3K.9.6, F3K.4.2)
// PUT  /api/contests/[contestId]/rounds/[roundNumber]/reflights — an officer records a re-flight's result (paper card or timed run) and signature
import { db } from "@/db";
import { grantReflight, recordReflight } from "@/db/queries/contest-reflights";
import { paperCardProblem } from "@/lib/contests/paper-card";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, ValidationError } from "@/lib/errors";
import { grantReflightSchema, recordReflightSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/** 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a pilot not drawn in the round or a later group that is not one; 409 granted already. */
export const POST = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, grantReflightSchema);
  const { round } = await requireOfficerRound(context.params);
  const done = await grantReflight(db, { roundId: round.id, userId: me.id, ...body });
  if (done === "no_slot") throw new ValidationError("This pilot is not drawn in this round.", []);
  if (done === "bad_group") throw new ValidationError("A later group is one of this round's groups flying after the pilot's own.", []);
  if (done === "granted_already") throw new ConflictError("granted_already", "This pilot has a re-flight in this round already.");
  return Response.json({ granted: true }, { status: 201, headers: { "cache-control": "no-store" } });
});

/** 401, 404, 403 as above; 422 no re-flight granted to this pilot in the round, or a lane not offered for the contest; 409 a task paper cards cannot carry. */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, recordReflightSchema);
  const { contestId, round } = await requireOfficerRound(context.params);
  const problem = body.flights !== null ? paperCardProblem(round.task) : null;
  if (problem) throw new ConflictError("paper_task", problem);
  const link = body.runId !== null && body.lane !== null ? { runId: body.runId, lane: body.lane } : null;
  const done = await recordReflight(db, { contestId, roundId: round.id, entryId: body.entryId, userId: me.id, flights: body.flights, link, signed: body.signed });
  if (done === "not_granted") throw new ValidationError("This pilot has no re-flight in this round.", []);
  if (done === "no_lane") throw new ValidationError("No such lane among the club's runs of the contest day with this round's task.", []);
  return Response.json({ recorded: true }, { headers: { "cache-control": "no-store" } });
});
