import { index, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";

/**
 * A practice plan a coach assigns to a pilot who grants them their season: a title and an ordered
 * list of items (lib/coach/plan-goals.ts PlanItem: a catalogue task, a goal in words, how many
 * windows, and where measurable a number to reach). Runs set up from an item name it
 * (runs.plan_id, runs.plan_item — a foreign key: the phone links a run only to a plan a pull brought
 * it, so the plan is always on the server first, and the push drops a link to any other); progress
 * is computed from those runs' derived results. Kept in its own file so db/schema/sessions.ts can
 * reference it without an import circle.
 */
export const practicePlans = pgTable(
  "practice_plans",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    pilotId: uuid("pilot_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    coachId: uuid("coach_id").references(() => users.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    items: jsonb("items").notNull().default([]),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    /** When the coach last changed the title or items (null: never). */
    updatedAt: timestamp("updated_at", { withTimezone: true }),
    /** When the coach closed the plan: it leaves the pilot's "Ready to fly" (runs flown from it still count in its progress). */
    closedAt: timestamp("closed_at", { withTimezone: true }),
  },
  (t) => [index("practice_plans_pilot_id_idx").on(t.pilotId)],
);

