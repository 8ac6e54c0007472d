// POST /api/contests/[contestId]/draw/swap — an officer has two pilots of a round trade groups
import { db } from "@/db";
import { swapInRound } from "@/db/queries/contest-draw-changes";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { contestIdSchema, swapSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/**
 * 401, 404, 403 as every officer route; allowed after the draw is locked (it is the day's tool).
 * 409 with the reason when nothing is drawn, the round has results, or the swap is refused
 * (same group, not in the round, a keep-apart broken); nothing changes then.
 */
export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const body = await parseJson(request, swapSchema);
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  const done = await swapInRound(db, { contestId: params.data.contestId, roundNumber: body.round, a: body.a, b: body.b, byUserId: user.id });
  if (!done.ok) throw new ConflictError(done.code, done.message);
  return Response.json({ summary: done.summary }, { headers: { "cache-control": "no-store" } });
});
