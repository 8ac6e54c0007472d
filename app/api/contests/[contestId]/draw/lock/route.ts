// POST /api/contests/[contestId]/draw/lock — an officer locks the draw (no re-draw after)
import { db } from "@/db";
import { lockDraw } from "@/db/queries/contest-draw";
import { route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { contestIdSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/** 401, 404, 403 as every officer route; 409 when nothing is drawn yet. Locking twice is fine. */
export const POST = route(async (_request: Request, context: Context) => {
  await requireUser();
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  if (!(await lockDraw(db, params.data.contestId))) throw new ConflictError("no_draw", "Make the draw first.");
  return Response.json({ locked: true }, { headers: { "cache-control": "no-store" } });
});
