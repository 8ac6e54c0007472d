import { bigint, doublePrecision, index, integer, jsonb, pgTable, primaryKey, smallint, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { models } from "./hangar";
import { runs } from "./sessions";
import { users } from "./users";

/**
 * An altimeter log uploaded for one lane of a run. The file itself is in object storage under
 * `objectKey` (random, not guessable). A row is "pending" from the presigned PUT until the server
 * has parsed the file; a file that fails is deleted together with its row, so nothing is kept.
 */
export const altimeterLogs = pgTable(
  "altimeter_logs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    ownerId: uuid("owner_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    runId: uuid("run_id").notNull().references(() => runs.id, { onDelete: "cascade" }),
    lane: smallint("lane").notNull(),
    objectKey: text("object_key").notNull().unique(),
    fileName: text("file_name").notNull(),
    loggerName: text("logger_name").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    status: text("status", { enum: ["pending", "parsed"] }).notNull().default("pending"),
    samples: integer("samples"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("altimeter_logs_run_id_idx").on(t.runId), index("altimeter_logs_owner_id_idx").on(t.ownerId)],
);

/**
 * A launch found in a log (lib/altimeter/detect.ts). Matched to a flight of the lane when its launch
 * lies within the tolerance on corrected time (`flightIndex`, `gapMs` = log time − launch time);
 * unmatched launches keep null there and are listed, never attached to a guessed flight.
 */
export const launchHeights = pgTable(
  "launch_heights",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    logId: uuid("log_id").notNull().references(() => altimeterLogs.id, { onDelete: "cascade" }),
    runId: uuid("run_id").notNull().references(() => runs.id, { onDelete: "cascade" }),
    lane: smallint("lane").notNull(),
    /** The launch instant in the log, moved onto the run's corrected timeline (ms since the epoch). */
    atMs: bigint("at_ms", { mode: "number" }).notNull(),
    heightM: doublePrecision("height_m").notNull(),
    /** The flight (index in the lane's derived flights) whose launch it matched; null = unmatched. */
    flightIndex: smallint("flight_index"),
    gapMs: integer("gap_ms"),
    /** The model the lane flew at that launch (its latest "model" event), if any. */
    modelId: uuid("model_id").references(() => models.id, { onDelete: "set null" }),
  },
  (t) => [index("launch_heights_run_id_idx").on(t.runId), index("launch_heights_model_id_idx").on(t.modelId)],
);

/** How a pilot's logger writes its CSV (lib/altimeter/mapping.ts), kept per logger for next time. */
export const loggerMappings = pgTable(
  "logger_mappings",
  {
    ownerId: uuid("owner_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    loggerName: text("logger_name").notNull(),
    mapping: jsonb("mapping").notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.ownerId, t.loggerName] })],
);
