import { index, pgTable, smallint, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import type { ReflightCause, ReflightPlacement } from "@/lib/events/schema";
import { contestEntries, contestRounds } from "./contests";
import { contestReflights } from "./contest-reflights";
import { users } from "./users";

export type ReflightRequestStatus = "open" | "granted" | "dismissed" | "withdrawn";

/**
 * A re-flight asked for on a timekeeper's phone: a `reflight` ruling event on a lane of a contest duty's
 * run (linked to the pilot's slot or re-flight, the pushing account its timekeeper). Its own table, not a
 * row of contest_reflights: a grant is an officer's decision (F3K.9.6: the contest director grants it),
 * and a request holds what a grant does not (the event, who asked on the phone and when, a dismissal).
 * The officer grants it (a contest_reflights row, prefilled from the request; `reflight_id`) or dismisses
 * it, with who and when. One request per event (`event_id` unique: a push sent again adds nothing).
 */
export const contestReflightRequests = pgTable(
  "contest_reflight_requests",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    roundId: uuid("round_id").notNull().references(() => contestRounds.id, { onDelete: "cascade" }),
    entryId: uuid("entry_id").notNull().references(() => contestEntries.id, { onDelete: "cascade" }),
    eventId: uuid("event_id").notNull(),
    runId: uuid("run_id").notNull(),
    lane: smallint("lane").notNull(),
    cause: text("cause").$type<ReflightCause>().notNull(),
    placement: text("placement").$type<ReflightPlacement>().notNull(),
    reason: text("reason"),
    askedBy: uuid("asked_by").references(() => users.id, { onDelete: "set null" }),
    /** The phone's time of the ruling, its clock corrected by the event's offset estimate when it has one. */
    askedAt: timestamp("asked_at", { withTimezone: true }).notNull(),
    status: text("status").$type<ReflightRequestStatus>().notNull().default("open"),
    decidedBy: uuid("decided_by").references(() => users.id, { onDelete: "set null" }),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    reflightId: uuid("reflight_id").references(() => contestReflights.id, { onDelete: "set null" }),
  },
  (t) => [uniqueIndex("contest_reflight_requests_event_uq").on(t.eventId), index("contest_reflight_requests_round_idx").on(t.roundId, t.status)],
);
