// POST /api/contests/[contestId]/draw/redraw — an officer draws the rounds not flown yet again
import { randomInt } from "node:crypto";
import { db } from "@/db";
import { redrawFrom } from "@/db/queries/contest-draw-changes";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { contestIdSchema, redrawSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/**
 * 401, 404, 403 as every officer route; allowed after the draw is locked (a withdrawal or a late
 * entry on the day). 409 with the reason when nothing is drawn, there is no such round, one of the
 * rounds to re-draw has a result, the fly-off has one (`fly_off_results`), or fewer than 2 pilots are entered.
 * A fly-off drawn without results is cleared (the summary says so).
 */
export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const body = await parseJson(request, redrawSchema);
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  const seed = body.seed ?? randomInt(0, 2_147_483_647);
  const done = await redrawFrom(db, { contestId: params.data.contestId, fromRound: body.fromRound, seed, byUserId: user.id });
  if (!done.ok) throw new ConflictError(done.code, done.message);
  return Response.json({ summary: done.summary, seed, maxMeetings: done.maxMeetings, apartBroken: done.apartBroken }, { status: 201, headers: { "cache-control": "no-store" } });
});
