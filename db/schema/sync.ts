import { bigint, doublePrecision, index, pgSequence, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { ackStatusEnum } from "./enums";
import { users } from "./users";

/**
 * One server-wide change number. Every row a device may pull carries the value it got at its
 * last change, beside the id of the transaction that made it (`xid`): pulls go in (xid,
 * server_seq) order and serve only transactions older than every one still running, so writers
 * run side by side and a cursor never skips a row (SYNC.md §3; db/queries/sync-pull.ts).
 */
export const syncSeq = pgSequence("sync_seq", { startWith: 1 });

/** A phone or browser, known by the id it generated; it belongs to the user who first pushed from it. */
export const devices = pgTable(
  "devices",
  {
    id: text("id").primaryKey(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    label: text("label"),
    lastSeenAt: timestamp("last_seen_at", { withTimezone: true }).notNull().defaultNow(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("devices_user_id_idx").on(t.userId)],
);

/** NTP-style exchanges as measured by a device (T1..T4 in ms; RFC 5905 §8). */
export const clockSamples = pgTable(
  "clock_samples",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    deviceId: text("device_id").notNull().references(() => devices.id, { onDelete: "cascade" }),
    t1: doublePrecision("t1").notNull(),
    t2: doublePrecision("t2").notNull(),
    t3: doublePrecision("t3").notNull(),
    t4: doublePrecision("t4").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("clock_samples_device_id_idx").on(t.deviceId)],
);

/**
 * A device's clock offset estimates (lib/clock ClockEstimate), from push requests and from the
 * offsets its events carried. The server interpolates between them to re-correct the device's
 * events recorded across an offline period (SYNC.md §4).
 */
export const deviceClockEstimates = pgTable(
  "device_clock_estimates",
  {
    deviceId: text("device_id").notNull().references(() => devices.id, { onDelete: "cascade" }),
    /** θ = server time − device wall time, ms. */
    thetaMs: doublePrecision("theta_ms").notNull(),
    /** δ, round trip of the chosen exchange, ms. */
    deltaMs: doublePrecision("delta_ms").notNull(),
    measuredAtWallMs: doublePrecision("measured_at_wall_ms").notNull(),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("device_clock_estimates_device_measured_uq").on(t.deviceId, t.measuredAtWallMs)],
);

/**
 * Items the server refused, kept for the record and for support (the device keeps its copy too).
 * One row per device and item: a replayed refusal adds nothing.
 */
export const syncRejections = pgTable(
  "sync_rejections",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    itemId: text("item_id").notNull(),
    deviceId: text("device_id").notNull(),
    userId: uuid("user_id").references(() => users.id, { onDelete: "set null" }),
    status: ackStatusEnum("status").notNull().default("rejected"),
    reason: text("reason").notNull(),
    serverSeq: bigint("server_seq", { mode: "number" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("sync_rejections_device_item_uq").on(t.deviceId, t.itemId)],
);
