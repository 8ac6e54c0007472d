import { z } from "zod";
import { epochMs, text } from "@/lib/events/bounds";

/**
 * How a logger writes its CSV: which column holds the time and which the height (or pressure),
 * in what units. Saved per logger name (db logger_mappings) and offered again next time; the
 * start instant of a "seconds" log belongs to one upload, so it is not part of what is saved.
 */
export const loggerMappingSchema = z.object({
  hasHeader: z.boolean(),
  /** 1-based column numbers, as a spreadsheet shows them. */
  timeColumn: z.number().int().min(1).max(64),
  /** "clock": hh:mm:ss[.fff] local time of day; "seconds": seconds since the start given with the upload. */
  timeKind: z.enum(["clock", "seconds"]),
  /** For clock times: the logger clock's offset from UTC in minutes (UTC+2 → 120). */
  utcOffsetMin: z.number().int().min(-14 * 60).max(14 * 60),
  valueColumn: z.number().int().min(1).max(64),
  /** Height in metres or feet, or pressure in hPa (converted with the ICAO standard atmosphere). */
  valueKind: z.enum(["m", "ft", "hPa"]),
});
export type LoggerMapping = z.infer<typeof loggerMappingSchema>;

export const loggerNameSchema = text(60).trim().min(1, "name the logger");

/** What one upload says about its file: the logger, its mapping, and for "seconds" logs the start. */
export const logUploadMappingSchema = z
  .object({ loggerName: loggerNameSchema, mapping: loggerMappingSchema, startAtMs: epochMs.optional() })
  .refine((m) => m.mapping.timeKind !== "seconds" || m.startAtMs !== undefined, {
    message: "a log timed in seconds needs the instant it started",
    path: ["startAtMs"],
  })
  .refine((m) => m.mapping.timeColumn !== m.mapping.valueColumn, { message: "time and height are in different columns", path: ["mapping", "valueColumn"] });
export type LogUploadMapping = z.infer<typeof logUploadMappingSchema>;
