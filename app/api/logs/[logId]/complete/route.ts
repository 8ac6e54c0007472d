// POST /api/logs/[logId]/complete — after the PUT: checks the stored file, parses it with the mapping, finds and matches launches; a bad file is deleted with its row
import { db } from "@/db";
import { deleteLog, getOwnLog, laneFlightsAndModels, storeParsedLog } from "@/db/queries/altimeter";
import { listModels } from "@/db/queries/models";
import { detectLaunches } from "@/lib/altimeter/detect";
import { logUploadMappingSchema } from "@/lib/altimeter/mapping";
import { matchLaunches } from "@/lib/altimeter/match";
import { LogFileError, parseAltimeterCsv } from "@/lib/altimeter/parse";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { AppError, ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import { modelAt } from "@/lib/hangar/stats";
import { deleteObject, headObject, readObjectText } from "@/lib/storage/server/s3";
import { LOG_CONTENT_TYPE, LOG_MAX_BYTES, logIdParamsSchema } from "@/lib/validations/altimeter";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ logId: string }> };

export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const upload = await parseJson(request, logUploadMappingSchema);
  const params = logIdParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such upload.");
  const log = await getOwnLog(db, { ownerId: user.id, logId: params.data.logId });
  if (!log) throw new NotFoundError("No such upload.");
  if (log.status === "parsed") throw new ConflictError("already_parsed", "This log has been read already.");
  const head = await headObject(log.objectKey);
  if (!head) throw new ConflictError("not_uploaded", "The file has not arrived yet: upload it again.");
  // from here on, a refusal deletes the object and the row: nothing of a bad file is kept
  const refuse = async (error: AppError) => {
    await deleteObject(log.objectKey);
    await deleteLog(db, log.id);
    throw error;
  };
  if (head.size > LOG_MAX_BYTES) return refuse(new AppError("too_large", "An altimeter log may be at most 5 MB.", 413));
  if (head.contentType.split(";")[0]!.trim() !== LOG_CONTENT_TYPE) return refuse(new AppError("unsupported_type", "Only CSV files (text/csv) can be uploaded.", 415));
  const text = await readObjectText(log.objectKey);
  if (text.includes("\u0000") || text.includes("\uFFFD")) return refuse(new ValidationError("The file is not a text CSV (binary or not UTF-8)."));
  const run = await laneFlightsAndModels(db, { runId: log.runId, lane: log.lane });
  let samples;
  try {
    samples = parseAltimeterCsv(text, upload, run.flights[0]?.launchAtMs ?? log.createdAt.getTime());
  } catch (e) {
    if (e instanceof LogFileError) {
      const issue = { path: e.line ? `line ${e.line}${e.column ? `, column ${e.column}` : ""}` : "file", message: e.message };
      return refuse(new ValidationError(e.message, [issue]));
    }
    throw e;
  }
  const matched = matchLaunches(detectLaunches(samples), run.flights.map((f) => ({ id: String(f.index), atMs: f.launchAtMs })));
  const mine = new Set((await listModels(db, { ownerId: user.id })).map((m) => m.id));
  const heights = matched.launches.map((l) => {
    const modelId = modelAt(run.choices, l.correctedMs);
    return {
      // corrected instants carry fractions of a millisecond (clock offsets); the columns hold whole ones
      atMs: Math.round(l.correctedMs), heightM: Math.round(l.heightM * 10) / 10, flightIndex: l.eventId === null ? null : Number(l.eventId), gapMs: l.gapMs === null ? null : Math.round(l.gapMs),
      modelId: modelId && mine.has(modelId) ? modelId : null,
    };
  });
  await storeParsedLog(db, { log, samples: samples.length, heights, mapping: upload.mapping });
  return Response.json({ logId: log.id, samples: samples.length, offsetMs: matched.offsetMs, launches: heights }, { headers: { "cache-control": "no-store" } });
});
