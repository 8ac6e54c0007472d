// GET /api/logs/[logId]/download — a presigned GET (one minute) for one of the pilot's own parsed logs
import { db } from "@/db";
import { getOwnLog } from "@/db/queries/altimeter";
import { route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { GET_TTL_S, presignGet } from "@/lib/storage/server/s3";
import { logIdParamsSchema } from "@/lib/validations/altimeter";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ logId: string }> };

export const GET = route(async (_request: Request, context: Context) => {
  const user = await requireUser();
  const params = logIdParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such log.");
  const log = await getOwnLog(db, { ownerId: user.id, logId: params.data.logId });
  if (!log || log.status !== "parsed") throw new NotFoundError("No such log.");
  return Response.json({ url: await presignGet(log.objectKey, log.fileName), expiresInS: GET_TTL_S }, { headers: { "cache-control": "no-store" } });
});
