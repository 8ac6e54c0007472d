import { date, index, integer, pgTable, primaryKey, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { runs } from "./sessions";
import { clubFields, clubs } from "./clubs";
import { users } from "./users";

/**
 * A field day: an officer opens a day at one of the club's fields; members' runs recorded at that
 * field that day sync into it. One day per club, field and date. (Replaces the older `field_days`,
 * which named its field by text and which nothing wrote runs into.)
 */
export const clubDays = pgTable(
  "club_days",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    clubId: uuid("club_id").notNull().references(() => clubs.id, { onDelete: "cascade" }),
    fieldId: uuid("field_id").notNull().references(() => clubFields.id, { onDelete: "cascade" }),
    /** The calendar day at the field, YYYY-MM-DD. */
    day: date("day", { mode: "string" }).notNull(),
    openedBy: uuid("opened_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    /** Set when an officer closes the day (all of the club's days on that date close together). */
    closedAt: timestamp("closed_at", { withTimezone: true }),
    closedBy: uuid("closed_by").references(() => users.id, { onDelete: "set null" }),
    /** When the day summary was queued to the members who asked for it: at most once per day. */
    summarySentAt: timestamp("summary_sent_at", { withTimezone: true }),
    /** When the close kept the day's runs (club_day_closed_runs): from then on no sync changes which runs belong. */
    runsFrozenAt: timestamp("runs_frozen_at", { withTimezone: true }),
  },
  (t) => [
    unique("club_days_club_field_day_uq").on(t.clubId, t.fieldId, t.day),
    index("club_days_club_id_day_idx").on(t.clubId, t.day),
  ],
);

/**
 * A run its pilot chose for a club day from the run page (whatever field its session names and
 * whenever it was flown): it shows on that day's board. One row per day and run.
 */
export const clubDayRuns = pgTable(
  "club_day_runs",
  {
    dayId: uuid("day_id").notNull().references(() => clubDays.id, { onDelete: "cascade" }),
    runId: uuid("run_id").notNull().references(() => runs.id, { onDelete: "cascade" }),
    chosenBy: uuid("chosen_by").notNull().references(() => users.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.dayId, t.runId] }), index("club_day_runs_run_id_idx").on(t.runId)],
);

/**
 * The runs that belonged to a day when an officer closed it: from then on the board lists these
 * and no others, so a phone that syncs later changes no day's list of runs. Written by the close,
 * one row per day row of the date and run.
 */
export const clubDayClosedRuns = pgTable(
  "club_day_closed_runs",
  {
    dayId: uuid("day_id").notNull().references(() => clubDays.id, { onDelete: "cascade" }),
    runId: uuid("run_id").notNull().references(() => runs.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.dayId, t.runId] }), index("club_day_closed_runs_run_id_idx").on(t.runId)],
);

/**
 * An officer's decision on a lane two phones recorded differently (the Day board lists both
 * versions side by side): which phone's record stands (null: a note only) and why, with who and
 * when. One per club, date, run and lane; a new decision replaces the old one.
 */
export const clubDayDecisions = pgTable(
  "club_day_decisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    clubId: uuid("club_id").notNull().references(() => clubs.id, { onDelete: "cascade" }),
    day: date("day", { mode: "string" }).notNull(),
    runId: uuid("run_id").notNull().references(() => runs.id, { onDelete: "cascade" }),
    lane: integer("lane").notNull(),
    /** The device whose version stands; null when the officer only left a note. */
    deviceId: text("device_id"),
    note: text("note").notNull().default(""),
    decidedBy: uuid("decided_by").references(() => users.id, { onDelete: "set null" }),
    decidedAt: timestamp("decided_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("club_day_decisions_lane_uq").on(t.clubId, t.day, t.runId, t.lane), index("club_day_decisions_run_id_idx").on(t.runId)],
);
