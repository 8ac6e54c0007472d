// POST /api/runs/[runId]/logs — a presigned PUT for an altimeter log of one lane (CSV, ≤ 5 MB); GET — the run's logs and launch heights (404 unless the run is yours)
import { db } from "@/db";
import { createPendingLog, deleteLog, listRunLaunchHeights, listStalePendingLogs, mayUploadFor, runForViewer } from "@/db/queries/altimeter";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { AppError, NotFoundError } from "@/lib/errors";
import { deleteObject, newObjectKey, presignPut } from "@/lib/storage/server/s3";
import { LOG_CONTENT_TYPE, LOG_MAX_BYTES, logUploadRequestSchema, runIdParamsSchema } from "@/lib/validations/altimeter";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ runId: string }> };
const noStore = { "cache-control": "no-store" };
const notFound = () => new NotFoundError("No such run in your logbook.");
/**
 * An upload asked for and never completed (the PUT URL lives 5 minutes) is stale after an hour:
 * each new upload by the same user first removes their stale ones, object and row, so an
 * abandoned upload is not kept forever (account deletion removes the rest).
 */
const STALE_PENDING_MS = 60 * 60_000;

async function dropStalePending(ownerId: string): Promise<void> {
  for (const log of await listStalePendingLogs(db, { ownerId, before: new Date(Date.now() - STALE_PENDING_MS) })) {
    await deleteObject(log.objectKey); // an object never PUT is no error to delete
    await deleteLog(db, log.id);
  }
}

async function runIdOf(context: Context): Promise<string> {
  const params = runIdParamsSchema.safeParse(await context.params);
  if (!params.success) throw notFound();
  return params.data.runId;
}

export const GET = route(async (_request: Request, context: Context) => {
  const user = await requireUser();
  const run = await runForViewer(db, { userId: user.id, runId: await runIdOf(context) });
  if (!run) throw notFound();
  return Response.json({ logs: await listRunLaunchHeights(db, { runId: run.runId }) }, { headers: noStore });
});

export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const body = await parseJson(request, logUploadRequestSchema);
  const runId = await runIdOf(context);
  if (body.sizeBytes > LOG_MAX_BYTES) throw new AppError("too_large", "An altimeter log may be at most 5 MB.", 413);
  if (body.contentType !== LOG_CONTENT_TYPE || !/\.csv$/i.test(body.fileName)) {
    throw new AppError("unsupported_type", "Only CSV files (text/csv, name ending .csv) can be uploaded.", 415);
  }
  const run = await runForViewer(db, { userId: user.id, runId });
  if (!run) throw notFound();
  if (!mayUploadFor(run, body.lane, user.id)) throw new NotFoundError("No lane of yours with that number in this run.");
  await dropStalePending(user.id);
  const objectKey = newObjectKey(`logs/${run.runId}`);
  const log = await createPendingLog(db, {
    ownerId: user.id, runId: run.runId, lane: body.lane, objectKey, fileName: body.fileName, loggerName: body.loggerName, sizeBytes: body.sizeBytes,
  });
  const url = await presignPut(objectKey, LOG_CONTENT_TYPE);
  return Response.json({ logId: log.id, url, contentType: LOG_CONTENT_TYPE, maxBytes: LOG_MAX_BYTES }, { status: 201, headers: noStore });
});
