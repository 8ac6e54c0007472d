import { index, pgTable, smallint, text, timestamp, uuid } from "drizzle-orm/pg-core";
import type { PenaltyCause } from "@/lib/events/schema";
import { contestEntries, contestRounds } from "./contests";
import { users } from "./users";

/**
 * A penalty an officer gave a pilot in a round (a fly-off round too), one row each: cause (the
 * causes of RULES.md "Penalties", lib/events/schema.ts PENALTY_CAUSES), points, an optional note, who
 * gave it and when. Never deleted: an officer's removal is itself recorded (`removed_by`,
 * `removed_at`, `removed_reason`) and a removed penalty no longer counts. How they count:
 * lib/contests/penalties.ts `roundPenalty` (the one place a round's penalties are summed).
 */
export const contestPenalties = pgTable(
  "contest_penalties",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    roundId: uuid("round_id").notNull().references(() => contestRounds.id, { onDelete: "cascade" }),
    entryId: uuid("entry_id").notNull().references(() => contestEntries.id, { onDelete: "cascade" }),
    cause: text("cause").$type<PenaltyCause>().notNull(),
    points: smallint("points").notNull(),
    note: text("note"),
    givenBy: uuid("given_by").references(() => users.id, { onDelete: "set null" }),
    givenAt: timestamp("given_at", { withTimezone: true }).notNull().defaultNow(),
    removedBy: uuid("removed_by").references(() => users.id, { onDelete: "set null" }),
    removedAt: timestamp("removed_at", { withTimezone: true }),
    removedReason: text("removed_reason"),
  },
  (t) => [index("contest_penalties_round_idx").on(t.roundId, t.entryId)],
);
