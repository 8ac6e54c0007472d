import { sql } from "drizzle-orm";
import { boolean, date, index, integer, jsonb, pgTable, smallint, text, timestamp, unique, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { clubs } from "./clubs";
import { contestStatusEnum, paymentStatusEnum } from "./enums";
import { guestPilots, users } from "./users";

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
    /** Entries close (and a withdrawal is refunded only) before this instant; null = until the contest day. */
    entriesCloseAt: timestamp("entries_close_at", { withTimezone: true }),
    /** Largest group the officer can staff (lanes, timekeepers); lib/contests/groups.ts plans the sizes. */
    maxGroupSize: smallint("max_group_size").notNull().default(10),
    prepMinutes: smallint("prep_minutes").notNull().default(5),
    noFlySeconds: smallint("no_fly_seconds").notNull().default(60),
    /** "f3k": the lowest round dropped from 6 rounds flown (F3K.10); "none": every round counts. */
    dropRule: text("drop_rule").notNull().default("f3k"),
    /** How an exact half of 0.1 point rounds in normalised scores (lib/scoring HalfRounding; the README's setting). */
    halves: text("halves").$type<"half-up" | "half-even" | "down">().notNull().default("half-up"),
    /** The edition of the class rules the contest flies (lib/tasks catalogue editions). */
    rulesEdition: text("rules_edition").notNull().default("F3K-2025"),
    /** How many pilots of the preliminary order fly the fly-off (ties at the cut-off fly too); null = no fly-off planned. */
    flyOffPilots: smallint("fly_off_pilots"),
    /** A practice event: the rules' round checks only warn. */
    practice: boolean("practice").notNull().default(false),
    /** The draw's seed (printed with it), null until drawn; locked: no re-draw. */
    drawSeed: integer("draw_seed"),
    drawLockedAt: timestamp("draw_locked_at", { withTimezone: true }),
    /** The public read-only results link's secret (base64url, 32 random bytes); null = no link. */
    publicToken: text("public_token").unique(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
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
    /** "senior" or "junior": juniors are also ranked among themselves (common practice). */
    pilotClass: text("pilot_class").$type<"senior" | "junior">().notNull().default("senior"),
    paymentStatus: paymentStatusEnum("payment_status").notNull().default("pending"),
    /** The card payment's id at the payments service (refunds name it), or "cash" when the officer marked it paid. */
    paymentRef: text("payment_ref"),
    paidAt: timestamp("paid_at", { withTimezone: true }),
    /** The officer who marked a cash payment. */
    paymentMarkedBy: uuid("payment_marked_by").references(() => users.id, { onDelete: "set null" }),
    /** Up to five models from the pilot's hangar (F3K.2.3): [{ id, name }] as entered. */
    models: jsonb("models").$type<{ id: string | null; name: string }[]>().notNull().default([]),
    /** Entries sharing this word (a timekeeper, a helper, a family) never fly in one group. */
    keepApart: text("keep_apart"),
    /** A paper entry the officer typed in (no account). */
    paper: boolean("paper").notNull().default(false),
    withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("contest_entries_contest_id_idx").on(t.contestId),
    uniqueIndex("contest_entries_one_live_uq").on(t.contestId, t.pilotUserId).where(sql`withdrawn_at is null and pilot_user_id is not null`),
  ],
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
    /** A paper card's flight times in tenths of a second, in flown order; null = not entered on paper. */
    paperFlights: jsonb("paper_flights").$type<number[]>(),
    /** Who entered the result (paper card, penalty, signature) and when. */
    recordedBy: uuid("recorded_by").references(() => users.id, { onDelete: "set null" }),
    recordedAt: timestamp("recorded_at", { withTimezone: true }),
    /** Signed by pilot and timekeeper (F3K.1.2: an unsigned result scores zero); `signedFrom` says how it was seen. */
    signedAt: timestamp("signed_at", { withTimezone: true }),
    signedFrom: text("signed_from"),
    /**
     * The timekeeper an officer assigned to this pilot in this round (a club member or an entered pilot who
     * does not fly in the group), with who assigned them and when. Their phone gets the pilot's lane by sync
     * and the run it times is linked here when it syncs back (db/queries/contest-timekeepers.ts).
     */
    timekeeperUserId: uuid("timekeeper_user_id").references(() => users.id, { onDelete: "set null" }),
    timekeeperAssignedBy: uuid("timekeeper_assigned_by").references(() => users.id, { onDelete: "set null" }),
    timekeeperAssignedAt: timestamp("timekeeper_assigned_at", { withTimezone: true }),
  },
  (t) => [unique("group_slots_round_entry_uq").on(t.roundId, t.entryId), index("group_slots_timekeeper_idx").on(t.timekeeperUserId)],
);

/** Webhook events of the payments service already applied, by the service's event id: a redelivery changes nothing. */
export const paymentEvents = pgTable("payment_events", {
  id: text("id").primaryKey(),
  type: text("type").notNull(),
  entryId: uuid("entry_id").references(() => contestEntries.id, { onDelete: "set null" }),
  receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
});
