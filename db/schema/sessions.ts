import { sql } from "drizzle-orm";
import {
  bigint, boolean, doublePrecision, index, integer, jsonb, pgTable, primaryKey, smallint, text, timestamp, unique, uuid,
} from "drizzle-orm/pg-core";
import { clubs } from "./clubs";
import { laneConsentStatusEnum } from "./enums";
import { practicePlans } from "./practice-plans";
import { guestPilots, users } from "./users";
import { writtenByXact } from "./xid";

const nextSeq = sql`nextval('sync_seq')`;

/** A visit to a field: where, when, conditions. Created on a phone (client id). */
export const fieldSessions = pgTable(
  "field_sessions",
  {
    id: uuid("id").primaryKey(),
    ownerId: uuid("owner_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    clubId: uuid("club_id").references(() => clubs.id, { onDelete: "set null" }),
    fieldName: text("field_name").notNull(),
    latitude: doublePrecision("latitude"),
    longitude: doublePrecision("longitude"),
    /** { windMs?, gustMs?, temperatureC?, notes? } */
    conditions: jsonb("conditions").notNull().default({}),
    startedAt: timestamp("started_at", { withTimezone: true }).notNull(),
    serverSeq: bigint("server_seq", { mode: "number" }).notNull().default(nextSeq),
    xid: writtenByXact(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("field_sessions_owner_id_idx").on(t.ownerId),
    index("field_sessions_server_seq_idx").on(t.serverSeq),
    index("field_sessions_xid_seq_idx").on(t.xid, t.serverSeq),
  ],
);

/** One task window timed on the line, for 1–4 pilots (lanes). The full task definition is stored with it. */
export const runs = pgTable(
  "runs",
  {
    id: uuid("id").primaryKey(),
    sessionId: uuid("session_id").notNull().references(() => fieldSessions.id, { onDelete: "cascade" }),
    createdBy: uuid("created_by").notNull().references(() => users.id),
    /** The task definition as the engine reads it, whole (editions change; RULES.md). */
    task: jsonb("task").notNull(),
    taskCode: text("task_code").notNull(),
    edition: text("edition").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull(),
    /** The assigned practice plan (db/schema/coaching.ts) and its item this window was set up from; null for most runs. */
    planId: uuid("plan_id").references(() => practicePlans.id, { onDelete: "set null" }),
    planItem: smallint("plan_item"),
    /**
     * Whether every flight of the run is launched at a start signal (an all-up task, i.e. task C:
     * lib/tasks flightsStartOnSignal), kept by PostgreSQL from `task` (never written): the Season's
     * turnaround leaves such runs out (db/queries/season/turnaround.ts) without reading each run's task JSON.
     */
    flightsOnSignal: boolean("flights_on_signal").notNull().generatedAlwaysAs(sql`coalesce((task ->> 'kind') = 'all-up', false)`),
    serverSeq: bigint("server_seq", { mode: "number" }).notNull().default(nextSeq),
    xid: writtenByXact(),
  },
  (t) => [index("runs_plan_id_idx").on(t.planId), index("runs_session_id_idx").on(t.sessionId), index("runs_created_by_idx").on(t.createdBy), index("runs_created_at_idx").on(t.createdAt), index("runs_server_seq_idx").on(t.serverSeq), index("runs_xid_seq_idx").on(t.xid, t.serverSeq)],
);

/** A pilot in a run, and the server's official result for them, derived from the events. */
export const runLanes = pgTable(
  "run_lanes",
  {
    runId: uuid("run_id").notNull().references(() => runs.id, { onDelete: "cascade" }),
    lane: smallint("lane").notNull(),
    pilotUserId: uuid("pilot_user_id").references(() => users.id, { onDelete: "set null" }),
    guestPilotId: uuid("guest_pilot_id").references(() => guestPilots.id, { onDelete: "set null" }),
    pilotName: text("pilot_name").notNull(),
    resultTenths: integer("result_tenths"),
    /** The points-lost breakdown and flights as last derived (a cache of a pure function of the events). */
    derived: jsonb("derived"),
    /**
     * The numbers the Season reads per lane, kept by PostgreSQL from `derived` whenever a derivation
     * is stored (a BEFORE trigger, migration "run-lanes-season-columns-by-trigger"; they were generated
     * columns: never write them from the app, the trigger overwrites them): the task's maximum,
     * the points lost in all and by cause (lib/tasks/breakdown.ts; a missing cause is 0), the penalty
     * points and the number of derived flights (= the lane's lane_flights rows). The season's
     * aggregates (db/queries/season, the roster, plan progress) read these plain integers instead of
     * unpacking the JSON of every lane on each request.
     */
    seasonMaxTenths: integer("season_max_tenths"),
    seasonLostTenths: integer("season_lost_tenths"),
    seasonPenaltyPoints: integer("season_penalty_points"),
    seasonLostGroundTime: integer("season_lost_ground_time"),
    seasonLostOverCap: integer("season_lost_over_cap"),
    seasonLostShortOfTarget: integer("season_lost_short_of_target"),
    seasonLostInvalid: integer("season_lost_invalid"),
    seasonLostNotCounted: integer("season_lost_not_counted"),
    seasonLostRoundZero: integer("season_lost_round_zero"),
    seasonFlightCount: integer("season_flight_count"),
    /**
     * The lane's flights as the Season's charts read them, one element per derived flight in flight
     * order (the lane's lane_flights rows by position), as the SQL functions of `derived` define them
     * (migration "season-lane-flight-arrays"; the trigger above rewrites only the elements of the
     * flights a derivation changed, tests/integration/season-lane-incremental.test.ts): the ground time since the previous landing in ms
     * (`lane_flights.ground_ms`), the duration in tenths of each flight that landed (null when it
     * did not), and each flight's target in seconds (the whole array null when no flight has one).
     * The summary (db/queries/season/summary.ts) unnests these from the lanes it already reads
     * instead of fetching 30,000 lane_flights rows by key.
     */
    seasonGroundMs: doublePrecision("season_ground_ms").array(),
    seasonLandedTenths: integer("season_landed_tenths").array(),
    seasonTargetSec: integer("season_target_sec").array(),
    /**
     * Per-lane aggregates the summary sums instead of unnesting every flight (migration "season-lane-bins"):
     * the ground times that count as turnaround on any task not launched on signals (`season_ground_ms`'s
     * elements that are known and not negative, in flight order; null when none: db/queries/season/turnaround.ts
     * isTurnaround, the lane's task applied by the query), and the landed flights counted in the duration
     * histogram's 11 bins (30 s each, the last open: DURATION_BIN_SEC, LAST_DURATION_BIN in db/queries/season/scope.ts).
     */
    seasonTurnaroundMs: doublePrecision("season_turnaround_ms").array(),
    seasonDurationBins: integer("season_duration_bins").array(),
    needsReview: boolean("needs_review").notNull().default(false),
    reviewReason: text("review_reason"),
  },
  (t) => [unique("run_lanes_run_lane_uq").on(t.runId, t.lane), index("run_lanes_pilot_user_id_idx").on(t.pilotUserId)],
);

/**
 * A pilot's decision on a lane someone else recorded for them (lib/sync/consent.ts): accepted
 * (counts in their record), disputed (with a reason the recorder sees) or hidden (left out of
 * their lists). No row means pending. Deciding again replaces the row; the run and its events
 * stay whatever the pilot decides.
 */
export const laneConsents = pgTable(
  "lane_consents",
  {
    runId: uuid("run_id").notNull().references(() => runs.id, { onDelete: "cascade" }),
    lane: smallint("lane").notNull(),
    pilotUserId: uuid("pilot_user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    status: laneConsentStatusEnum("status").notNull(),
    reason: text("reason"),
    decidedAt: timestamp("decided_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.runId, t.lane] }), index("lane_consents_pilot_user_id_idx").on(t.pilotUserId)],
);
