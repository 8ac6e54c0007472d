// POST /api/models/[modelId]/repairs — adds a repair (date, work, mass after) to one of the pilot's models
import { db } from "@/db";
import { addRepair } from "@/db/queries/models";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { modelIdSchema, repairInputSchema } from "@/lib/validations/hangar";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ modelId: string }> };

export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const repair = await parseJson(request, repairInputSchema);
  const params = modelIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such model in your hangar.");
  const row = await addRepair(db, { ownerId: user.id, modelId: params.data.modelId, repair });
  if (!row) throw new NotFoundError("No such model in your hangar.");
  return Response.json({ repair: row }, { status: 201, headers: { "cache-control": "no-store" } });
});
