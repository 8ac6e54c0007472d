// POST /api/contests/[contestId]/entries — a signed-in member of the contest's club enters, with up to five hangar models (F3K.2.3)
import { db } from "@/db";
import { enterPilot } from "@/db/queries/contests";
import { parseJson, route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import { contestIdSchema, enterSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/** 401 signed out, 404 no such contest or not a member, 409 entered already, 422 a model not in the pilot's hangar. */
export const POST = route(async (request: Request, context: Context) => {
  await requireUser();
  const body = await parseJson(request, enterSchema);
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  const me = await requireContestRole(params.data.contestId, "member");
  const row = await enterPilot(db, { contestId: params.data.contestId, userId: me.id, pilotName: me.name ?? me.email, modelIds: body.modelIds });
  if (row === "taken") throw new ConflictError("entered", "You are entered already.");
  if (row === "models") throw new ValidationError("Choose models from your own hangar.");
  return Response.json({ entry: { id: row.id } }, { status: 201, headers: { "cache-control": "no-store" } });
});
