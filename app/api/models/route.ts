// GET /api/models — the signed-in pilot's hangar; POST /api/models — adds a model (a caution, never a refusal, over the class limits)
import { db } from "@/db";
import { createModel, listModels } from "@/db/queries/models";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { classCautions } from "@/lib/hangar/limits";
import { modelInputSchema } from "@/lib/validations/hangar";

export const dynamic = "force-dynamic";
const noStore = { "cache-control": "no-store" };

export const GET = route(async () => {
  const user = await requireUser();
  const models = await listModels(db, { ownerId: user.id });
  return Response.json({ models: models.map((m) => ({ ...m, cautions: classCautions(m) })) }, { headers: noStore });
});

export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const input = await parseJson(request, modelInputSchema);
  const model = await createModel(db, { ownerId: user.id, input });
  return Response.json({ model, cautions: classCautions(model) }, { status: 201, headers: noStore });
});
