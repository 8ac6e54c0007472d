import { boolean, date, index, integer, jsonb, pgTable, smallint, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { clubs } from "./clubs";
import { contestStatusEnum, paymentStatusEnum } from "./enums";
import { guestPilots, users } from "./users";

/** A club's day at a field: every member's sessions that day sync into it (the Day board). */
export const fieldDays = pgTable(
  "field_days",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    clubId: uuid("club_id").notNull().references(() => clubs.id, { onDelete: "cascade" }),
    day: date("day").notNull(),
    fieldName: text("field_name").notNull(),
    createdBy: uuid("created_by").notNull().references(() => users.id),
  },
  (t) => [index("field_days_club_id_idx").on(t.clubId)],
);

export const contests = pgTable(
  "contests",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    clubId: uuid("club_id").notNull().references(() => clubs.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    startsOn: date("starts_on").notNull(),
    fieldName: text("field_name").notNull(),
    status: contestStatusEnum("status").notNull().default("draft"),
    /** Entry fee in the smallest currency unit; null = free. */
    entryFeeCents: integer("entry_fee_cents"),
    currency: text("currency").notNull().default("eur"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("contests_club_id_idx").on(t.clubId)],
);

/** A pilot entered in a contest (a member or a named guest), with the fee's state. */
export const contestEntries = pgTable(
  "contest_entries",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    contestId: uuid("contest_id").notNull().references(() => contests.id, { onDelete: "cascade" }),
    pilotUserId: uuid("pilot_user_id").references(() => users.id),
    guestPilotId: uuid("guest_pilot_id").references(() => guestPilots.id),
    pilotName: text("pilot_name").notNull(),
    team: text("team"),
    paymentStatus: paymentStatusEnum("payment_status").notNull().default("pending"),
    paymentRef: text("payment_ref"),
  },
  (t) => [index("contest_entries_contest_id_idx").on(t.contestId)],
);

/** A round: one task for everyone; `isFlyOff` keeps fly-off rounds apart (F3K.10). */
export const contestRounds = pgTable(
  "contest_rounds",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    contestId: uuid("contest_id").notNull().references(() => contests.id, { onDelete: "cascade" }),
    number: smallint("number").notNull(),
    isFlyOff: boolean("is_fly_off").notNull().default(false),
    task: jsonb("task").notNull(),
  },
  (t) => [unique("contest_rounds_contest_number_uq").on(t.contestId, t.isFlyOff, t.number)],
);

/** The draw: which entry flies in which group of a round, and the run that timed it. */
export const groupSlots = pgTable(
  "group_slots",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    roundId: uuid("round_id").notNull().references(() => contestRounds.id, { onDelete: "cascade" }),
    groupNumber: smallint("group_number").notNull(),
    entryId: uuid("entry_id").notNull().references(() => contestEntries.id, { onDelete: "cascade" }),
    runId: uuid("run_id"),
    lane: smallint("lane"),
    penaltyPoints: integer("penalty_points").notNull().default(0),
  },
  (t) => [unique("group_slots_round_entry_uq").on(t.roundId, t.entryId)],
);
