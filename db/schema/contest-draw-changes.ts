import { index, integer, pgTable, smallint, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { contests } from "./contests";
import { users } from "./users";

/**
 * What an officer changed in a contest's draw after it was made, with who and when: two pilots
 * of a round trading groups ("swap"), or the rounds from `roundNumber` on drawn again ("redraw",
 * with its seed). Shown under the draw, so every pilot can see why their group changed.
 */
export const contestDrawChanges = pgTable(
  "contest_draw_changes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    contestId: uuid("contest_id").notNull().references(() => contests.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: ["swap", "redraw"] }).notNull(),
    roundNumber: smallint("round_number").notNull(),
    /** The change in words, names as they were then ("Pilot B (group 1) and Pilot H (group 2) traded groups"). */
    summary: text("summary").notNull(),
    seed: integer("seed"),
    byUserId: uuid("by_user_id").references(() => users.id, { onDelete: "set null" }),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("contest_draw_changes_contest_idx").on(t.contestId, t.at)],
);
