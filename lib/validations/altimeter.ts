import { z } from "zod";
import { logUploadMappingSchema } from "@/lib/altimeter/mapping";
import { int4, text } from "./bounds";

/** An altimeter log is a CSV of at most 5 MB (a 20 Hz log of a whole day is far less). */
export const LOG_MAX_BYTES = 5 * 1024 * 1024;
export const LOG_CONTENT_TYPE = "text/csv";

/** Asking for an upload URL: which lane, what file (checked against the caps in the route), how to read it. */
export const logUploadRequestSchema = z.intersection(
  logUploadMappingSchema,
  z.object({
    lane: z.number().int().min(0).max(3),
    fileName: text(200).trim().min(1),
    sizeBytes: int4(1),
    contentType: text(200),
  }),
);
export type LogUploadRequest = z.infer<typeof logUploadRequestSchema>;

export const runIdParamsSchema = z.object({ runId: z.uuid() });
export const logIdParamsSchema = z.object({ logId: z.uuid() });
