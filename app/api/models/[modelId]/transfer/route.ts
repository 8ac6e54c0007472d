// POST /api/models/[modelId]/transfer — hands a sold model to another account, with its history only if the seller says so
import { db } from "@/db";
import { transferModel } from "@/db/queries/models";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError, ValidationError } from "@/lib/errors";
import { modelIdSchema, transferInputSchema } from "@/lib/validations/hangar";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ modelId: string }> };

export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const body = await parseJson(request, transferInputSchema);
  const params = modelIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such model in your hangar.");
  const outcome = await transferModel(db, { ownerId: user.id, modelId: params.data.modelId, ...body });
  if (outcome.kind === "not-found") throw new NotFoundError("No such model in your hangar.");
  if (outcome.kind === "no-buyer") throw new ValidationError("No active account uses that e-mail address.", [{ path: "email", message: "no account" }]);
  if (outcome.kind === "self") throw new ValidationError("The model is already yours.", [{ path: "email", message: "your own address" }]);
  return Response.json({ transferred: true, withHistory: body.withHistory }, { headers: { "cache-control": "no-store" } });
});
