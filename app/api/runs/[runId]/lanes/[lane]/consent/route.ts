// POST /api/runs/[runId]/lanes/[lane]/consent — the lane's pilot accepts, disputes or hides a run someone else recorded for them, or takes the decision back ("pending": un-hide)
import { db } from "@/db";
import { decideLaneConsent } from "@/db/queries/consent";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { laneConsentParamsSchema, laneConsentRequestSchema } from "@/lib/validations/consent";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ runId: string; lane: string }> };

export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const body = await parseJson(request, laneConsentRequestSchema);
  const params = laneConsentParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No run recorded for you at that lane.");
  const outcome = await decideLaneConsent(db, {
    userId: user.id, runId: params.data.runId, lane: params.data.lane, decision: body.decision, reason: body.reason ?? null,
  });
  if (outcome.kind === "not-found") throw new NotFoundError("No run recorded for you at that lane.");
  if (outcome.kind === "own") throw new ConflictError("own_record", "You recorded this run yourself: it is in your record already.");
  return Response.json({ consent: outcome.consent }, { headers: { "cache-control": "no-store" } });
});
