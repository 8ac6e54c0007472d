// DELETE /api/coach-grants/[grantId] — the pilot revokes a coach's grant or an open offer, at once (404 for anyone else's)
import { db } from "@/db";
import { revokeGrant } from "@/db/queries/coach/grants";
import { route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { grantIdSchema } from "@/lib/validations/coach";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ grantId: string }> };

export const DELETE = route(async (_request: Request, context: Context) => {
  const user = await requireUser();
  const params = grantIdSchema.safeParse(await context.params);
  if (!params.success || !(await revokeGrant(db, user.id, params.data.grantId))) throw new NotFoundError("No such grant of yours.");
  return new Response(null, { status: 204 });
});
