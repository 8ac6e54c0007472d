// POST /api/models/[modelId]/transfer — offers the model to whoever holds an e-mail address (the answer never says whether it has an account);
// DELETE — withdraws the offer while it waits
import { db } from "@/db";
import { offerModel, withdrawModelOffer } from "@/db/queries/model-offers";
import { getModel } from "@/db/queries/models";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { modelIdSchema, transferInputSchema } from "@/lib/validations/hangar";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ modelId: string }> };
const NO_STORE = { "cache-control": "private, no-store" };
const NO_MODEL = "No such model in your hangar.";

export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const body = await parseJson(request, transferInputSchema);
  const params = modelIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError(NO_MODEL);
  if (!(await getModel(db, { ownerId: user.id, modelId: params.data.modelId }))) throw new NotFoundError(NO_MODEL); // someone else's: 404 before anything else
  if (body.email === user.email.toLowerCase()) throw new ValidationError("That is your own address: offer the model to the buyer's.", [{ path: "email", message: "your own address" }]);
  const offer = await offerModel(db, { sellerId: user.id, modelId: params.data.modelId, email: body.email, withHistory: body.withHistory });
  if (!offer) throw new NotFoundError(NO_MODEL);
  // the same reply for every address: whether it has an account is not the seller's to learn
  return Response.json({ offered: true, withHistory: body.withHistory }, { status: 202, headers: NO_STORE });
});

export const DELETE = route(async (_request: Request, context: Context) => {
  const user = await requireUser();
  const params = modelIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No offer of that model is waiting.");
  if (!(await withdrawModelOffer(db, { sellerId: user.id, modelId: params.data.modelId }))) throw new NotFoundError("No offer of that model is waiting.");
  return Response.json({ withdrawn: true }, { headers: NO_STORE });
});
