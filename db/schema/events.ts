import { sql } from "drizzle-orm";
import { bigint, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { runs } from "./sessions";
import { users } from "./users";
import { writtenByXact } from "./xid";

/**
 * The append-only log of the flight line (SYNC.md §1). Each event is stored once: unique id,
 * unique (device, seq). Raw device times are kept beside the corrected time so a better clock
 * estimate can re-correct later.
 */
export const events = pgTable(
  "events",
  {
    id: uuid("id").primaryKey(),
    runId: uuid("run_id").notNull().references(() => runs.id, { onDelete: "cascade" }),
    deviceId: text("device_id").notNull(),
    seq: integer("seq").notNull(),
    recordedBy: uuid("recorded_by").notNull().references(() => users.id),
    kind: text("kind").notNull(),
    body: jsonb("body").notNull(),
    wallMs: doublePrecision("wall_ms").notNull(),
    monoMs: doublePrecision("mono_ms").notNull(),
    pageId: text("page_id").notNull(),
    offsetThetaMs: doublePrecision("offset_theta_ms"),
    offsetDeltaMs: doublePrecision("offset_delta_ms"),
    offsetMeasuredAtMs: doublePrecision("offset_measured_at_ms"),
    correctedMs: doublePrecision("corrected_ms").notNull(),
    uncertaintyMs: doublePrecision("uncertainty_ms"),
    serverSeq: bigint("server_seq", { mode: "number" }).notNull().default(sql`nextval('sync_seq')`),
    xid: writtenByXact(),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique("events_device_seq_uq").on(t.deviceId, t.seq),
    // a pull reads each visible run's events after its cursor from here (db/queries/sync-pull.ts);
    // the same index serves every read of a run's events and the foreign key
    index("events_run_xid_seq_idx").on(t.runId, t.xid, t.serverSeq),
  ],
);
