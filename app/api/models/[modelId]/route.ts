// GET /api/models/[modelId] — one of the pilot's models with its repairs and record; PATCH — changes it (404 for anyone else's)
import { db } from "@/db";
import { getModel, listRepairs, updateModel } from "@/db/queries/models";
import { listModelLanes } from "@/db/queries/model-record";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { classCautions } from "@/lib/hangar/limits";
import { modelStats } from "@/lib/hangar/stats";
import { modelIdSchema, modelPatchSchema } from "@/lib/validations/hangar";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ modelId: string }> };
const noStore = { "cache-control": "no-store" };

async function modelIdOf(context: Context): Promise<string> {
  const params = modelIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such model in your hangar.");
  return params.data.modelId;
}

export const GET = route(async (_request: Request, context: Context) => {
  const user = await requireUser();
  const modelId = await modelIdOf(context);
  const model = await getModel(db, { ownerId: user.id, modelId });
  if (!model) throw new NotFoundError("No such model in your hangar.");
  const [repairs, lanes] = await Promise.all([
    listRepairs(db, { ownerId: user.id, modelId }),
    listModelLanes(db, { modelId, ownerIds: [model.ownerId, ...model.formerOwnerIds] }),
  ]);
  return Response.json({ model, cautions: classCautions(model), repairs, stats: modelStats(modelId, lanes) }, { headers: noStore });
});

export const PATCH = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const input = await parseJson(request, modelPatchSchema);
  const model = await updateModel(db, { ownerId: user.id, modelId: await modelIdOf(context), input });
  if (!model) throw new NotFoundError("No such model in your hangar.");
  return Response.json({ model, cautions: classCautions(model) }, { headers: noStore });
});
