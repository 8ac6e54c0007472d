import { date, index, pgTable, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { clubFields, clubs } from "./clubs";
import { users } from "./users";

/**
 * A field day: an officer opens a day at one of the club's fields; members' runs recorded at that
 * field that day sync into it. One day per club, field and date.
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
  },
  (t) => [
    unique("club_days_club_field_day_uq").on(t.clubId, t.fieldId, t.day),
    index("club_days_club_id_day_idx").on(t.clubId, t.day),
  ],
);
