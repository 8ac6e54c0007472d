// PATCH /api/admin/users/[userId] — an admin disables, re-enables or changes the site role of an account (effective at its next request; audited)
import { db } from "@/db";
import { changeUser } from "@/db/queries/admin-users";
import { parseJson, route } from "@/lib/api";
import { requireRole } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { adminUserActionSchema, adminUserParamsSchema } from "@/lib/validations/admin";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ userId: string }> };

export const PATCH = route(async (request: Request, context: Context) => {
  const admin = await requireRole("admin");
  const change = await parseJson(request, adminUserActionSchema);
  const params = adminUserParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such account.");
  const outcome = await changeUser(db, { actorId: admin.id, userId: params.data.userId, change });
  if (outcome.kind === "not-found") throw new NotFoundError("No such account.");
  if (outcome.kind === "last-admin") {
    throw new ConflictError("last_admin", "This is the last active admin: make another account admin first.");
  }
  return Response.json({ user: outcome.user, changed: outcome.kind === "changed" }, { headers: { "cache-control": "no-store" } });
});
