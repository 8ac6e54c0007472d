import { index, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import type { DisputeAction, DisputeStatus } from "@/lib/contests/disputes";
import { contestEntries, contestRounds } from "./contests";
import { users } from "./users";

/**
 * A dispute (protest) about one pilot's result in a round (a fly-off round too), as an officer
 * recorded it: what is disputed, who lodged it (the pilot or a team manager, as named) and when, who
 * recorded it; then its resolution (upheld or rejected, the outcome in words, who and when) and, when
 * upheld, which existing officer action carries it out (lib/contests/disputes.ts). It never changes
 * a result by itself. While open, the standings mark the slot "result under dispute".
 */
export const contestDisputes = pgTable(
  "contest_disputes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    roundId: uuid("round_id").notNull().references(() => contestRounds.id, { onDelete: "cascade" }),
    entryId: uuid("entry_id").notNull().references(() => contestEntries.id, { onDelete: "cascade" }),
    subject: text("subject").notNull(),
    /** Who lodged it, as the officer wrote it down (e.g. "the pilot", "team manager of Updraft"). Never public. */
    lodgedBy: text("lodged_by").notNull(),
    /** When it was lodged, as the officer entered it (default: when recorded); not in the future, at most 2 days before the contest's day. */
    lodgedAt: timestamp("lodged_at", { withTimezone: true }).notNull().defaultNow(),
    /** When the officer recorded it (the server's clock). */
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
    recordedBy: uuid("recorded_by").references(() => users.id, { onDelete: "set null" }),
    status: text("status").$type<DisputeStatus>().notNull().default("open"),
    outcome: text("outcome"),
    action: text("action").$type<DisputeAction>(),
    resolvedBy: uuid("resolved_by").references(() => users.id, { onDelete: "set null" }),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
  },
  (t) => [index("contest_disputes_round_idx").on(t.roundId, t.entryId)],
);
