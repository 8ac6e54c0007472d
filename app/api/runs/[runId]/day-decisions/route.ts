// GET /api/runs/[runId]/day-decisions — club days whose officers counted another record for a lane of this run
import { db } from "@/db";
import { listRunDayDecisions } from "@/db/queries/run-day-decisions";
import { route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { pathId } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ runId: string }> };

/**
 * 401 signed out; otherwise 200 with the decisions the user may see (db/queries/run-day-decisions.ts:
 * the lane's pilot, and members of the deciding club who set up or fly in the run): an empty list for
 * anyone else, and for a run that is not one, so the answer says nothing about decisions they may not see.
 */
export const GET = route(async (_request: Request, context: Context) => {
  const user = await requireUser();
  const runId = pathId((await context.params).runId);
  const decisions = runId === null ? [] : await listRunDayDecisions(db, { userId: user.id, runId });
  return Response.json({ decisions }, { headers: { "cache-control": "no-store" } });
});
