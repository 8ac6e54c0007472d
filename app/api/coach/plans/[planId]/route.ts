// PATCH /api/coach/plans/[planId] — the coach who assigned a plan edits its title and items, or closes / reopens it
// (404 for anyone else, and once the pilot revoked the grant)
import { db } from "@/db";
import { updatePlan } from "@/db/queries/coach/plans";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { planIdParamsSchema, planUpdateSchema } from "@/lib/validations/coach";

export const dynamic = "force-dynamic";

export const PATCH = route(async (request: Request, context: { params: Promise<{ planId: string }> }) => {
  const user = await requireUser();
  const params = planIdParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such plan of yours.");
  const change = await parseJson(request, planUpdateSchema);
  const plan = await updatePlan(db, { coachId: user.id, planId: params.data.planId, change });
  if (!plan) throw new NotFoundError("No such plan of yours.");
  return Response.json({ plan });
});
