import { sql } from "drizzle-orm";
import { check, index, jsonb, pgTable, smallint, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { contestReflights } from "./contest-reflights";
import { groupSlots } from "./contests";
import { users } from "./users";

/**
 * A second record of one pilot's round result kept for the officer's decision: what a slot — or a
 * re-flight grant — held before a newer record replaced it (a timekeeper's phone run over a paper card
 * or an earlier run), or a timed run a paper card now outranks. It belongs to exactly one of a slot
 * (`slot_id`) or a grant (`reflight_id`): both hold the same record columns, so one table and one
 * decision path serve both. Pending while `outcome` is null; the officer's decision (`decided_by`,
 * `decided_at`) counts it ("counted": it becomes the slot's or grant's record) or sets it aside.
 */
export const slotRecords = pgTable(
  "slot_records",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    slotId: uuid("slot_id").references(() => groupSlots.id, { onDelete: "cascade" }),
    reflightId: uuid("reflight_id").references(() => contestReflights.id, { onDelete: "cascade" }),
    paperFlights: jsonb("paper_flights").$type<number[]>(),
    runId: uuid("run_id"),
    lane: smallint("lane"),
    recordedBy: uuid("recorded_by").references(() => users.id, { onDelete: "set null" }),
    recordedAt: timestamp("recorded_at", { withTimezone: true }),
    signedAt: timestamp("signed_at", { withTimezone: true }),
    signedFrom: text("signed_from"),
    keptAt: timestamp("kept_at", { withTimezone: true }).notNull().defaultNow(),
    outcome: text("outcome").$type<"counted" | "set-aside">(),
    decidedBy: uuid("decided_by").references(() => users.id, { onDelete: "set null" }),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
  },
  (t) => [
    index("slot_records_slot_idx").on(t.slotId),
    index("slot_records_reflight_idx").on(t.reflightId),
    check("slot_records_one_holder_ck", sql`num_nonnulls(${t.slotId}, ${t.reflightId}) = 1`),
  ],
);
