import { boolean, index, jsonb, pgTable, smallint, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import type { ReflightCause, ReflightPlacement } from "@/lib/events/schema";
import { contestEntries, contestRounds } from "./contests";
import { users } from "./users";

/**
 * A re-flight an officer granted a pilot in a round (F3K.9.6, F3K.4.2), with why, where it is flown,
 * who granted it and when, and its result: a paper card's flight times or a timed run's lane, and
 * its own signature (F3K.1.2). Which of the pilot's two results stands is lib/scoring/reflight.ts
 * `standingResult`, applied by lib/contests/standings.ts. `entitled` false: a group mate who flies
 * again with the re-flyer (original group or new group), who keeps the better of their two results.
 */
export const contestReflights = pgTable(
  "contest_reflights",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    roundId: uuid("round_id").notNull().references(() => contestRounds.id, { onDelete: "cascade" }),
    entryId: uuid("entry_id").notNull().references(() => contestEntries.id, { onDelete: "cascade" }),
    cause: text("cause").$type<ReflightCause>().notNull(),
    placement: text("placement").$type<ReflightPlacement>().notNull(),
    entitled: boolean("entitled").notNull().default(true),
    /** The group the re-flight is flown in (its result is normalised there when it stands). */
    groupNumber: smallint("group_number").notNull(),
    reason: text("reason"),
    grantedBy: uuid("granted_by").references(() => users.id, { onDelete: "set null" }),
    grantedAt: timestamp("granted_at", { withTimezone: true }).notNull().defaultNow(),
    paperFlights: jsonb("paper_flights").$type<number[]>(),
    runId: uuid("run_id"),
    lane: smallint("lane"),
    recordedBy: uuid("recorded_by").references(() => users.id, { onDelete: "set null" }),
    recordedAt: timestamp("recorded_at", { withTimezone: true }),
    signedAt: timestamp("signed_at", { withTimezone: true }),
    signedFrom: text("signed_from"),
    /** The timekeeper whose phone times the re-flight (a duty in the pull; its pushed lane becomes the re-flight's result), who named them and when. */
    timekeeperUserId: uuid("timekeeper_user_id").references(() => users.id, { onDelete: "set null" }),
    timekeeperAssignedBy: uuid("timekeeper_assigned_by").references(() => users.id, { onDelete: "set null" }),
    timekeeperAssignedAt: timestamp("timekeeper_assigned_at", { withTimezone: true }),
  },
  (t) => [unique("contest_reflights_round_entry_uq").on(t.roundId, t.entryId), index("contest_reflights_timekeeper_idx").on(t.timekeeperUserId)],
);
