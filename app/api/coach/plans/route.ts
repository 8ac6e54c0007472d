// GET /api/coach/plans — the practice plans this coach assigned to pilots who still grant them, with progress
// POST /api/coach/plans — assign a plan (title, items) to a granting pilot (404 without the grant)
import { db } from "@/db";
import { createPlan, plansOfCoach } from "@/db/queries/coach/plans";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { planCreateSchema } from "@/lib/validations/coach";

export const dynamic = "force-dynamic";

export const GET = route(async () => {
  const user = await requireUser();
  return Response.json({ plans: await plansOfCoach(db, user.id) }, { headers: { "cache-control": "private, no-store" } });
});

export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const { pilotId, ...plan } = await parseJson(request, planCreateSchema);
  const created = await createPlan(db, { coachId: user.id, pilotId, plan });
  if (!created) throw new NotFoundError("No such pilot lets you see their season.");
  return Response.json({ plan: created }, { status: 201 });
});
