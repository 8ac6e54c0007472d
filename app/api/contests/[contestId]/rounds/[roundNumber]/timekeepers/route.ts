// PUT /api/contests/[contestId]/rounds/[roundNumber]/timekeepers — an officer assigns a group's timekeepers
import { db } from "@/db";
import { saveGroupTimekeepers } from "@/db/queries/contest-timekeepers";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ValidationError } from "@/lib/errors";
import { groupTimekeepersSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * Each named pilot's timekeeper in one group of the round (null: none), all or nothing, stored with
 * who and when. 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a
 * pilot not in the group, a timekeeper who flies in it, who is neither a club member nor an entered
 * pilot, or who would time more than four of its pilots (lib/contests/timekeepers.ts).
 */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, groupTimekeepersSchema);
  const { contestId, round } = await requireOfficerRound(context.params);
  const done = await saveGroupTimekeepers(db, {
    contestId: contestId, roundId: round.id, groupNumber: body.groupNumber, userId: me.id, choices: body.timekeepers,
  });
  if (!done.saved) throw new ValidationError(done.problem, []);
  return Response.json({ saved: true }, { headers: { "cache-control": "no-store" } });
});
