// POST /api/admin/mail/[mailId]/retry — an admin sends a failed e-mail again: due at once with fresh attempts (audited)
import { db } from "@/db";
import { retryMail } from "@/db/queries/admin-mail";
import { parseJson, route } from "@/lib/api";
import { requireRole } from "@/lib/auth/session";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { drainAfterResponse } from "@/lib/mail/server/drain-after";
import { adminMailParamsSchema, adminMailRetrySchema } from "@/lib/validations/admin";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ mailId: string }> };

export const POST = route(async (request: Request, context: Context) => {
  const admin = await requireRole("admin");
  await parseJson(request, adminMailRetrySchema);
  const params = adminMailParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such message.");
  const outcome = await retryMail(db, { actorId: admin.id, mailId: params.data.mailId });
  if (outcome === "not-found") throw new NotFoundError("No such message.");
  if (outcome === "not-failed") throw new ConflictError("not_failed", "This message has not failed: there is nothing to retry.");
  drainAfterResponse();
  return Response.json({ retried: true }, { status: 202, headers: { "cache-control": "no-store" } });
});
