// POST /api/model-offers/[offerId] — the account the model was offered to accepts (the model moves) or declines
import { db } from "@/db";
import { answerModelOffer } from "@/db/queries/model-offers";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { offerAnswerSchema, offerIdSchema } from "@/lib/validations/hangar";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ offerId: string }> };
const NO_OFFER = "No such offer is waiting for you.";

export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const body = await parseJson(request, offerAnswerSchema);
  const params = offerIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError(NO_OFFER);
  const outcome = await answerModelOffer(db, { user, offerId: params.data.offerId, answer: body.answer });
  if (outcome.kind === "not-found") throw new NotFoundError(NO_OFFER);
  return Response.json(outcome.kind === "accepted" ? { answer: "accepted", modelId: outcome.modelId } : { answer: "declined" }, { headers: { "cache-control": "private, no-store" } });
});
