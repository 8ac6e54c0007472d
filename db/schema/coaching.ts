import { index, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { fieldSessions } from "./sessions";
import { users } from "./users";

/** A coach's note on a pilot's session. */
export const coachNotes = pgTable(
  "coach_notes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id").notNull().references(() => fieldSessions.id, { onDelete: "cascade" }),
    coachId: uuid("coach_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    body: text("body").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("coach_notes_session_id_idx").on(t.sessionId)],
);

/** A practice plan a coach assigns: an ordered list of task definitions with notes. */
export const practicePlans = pgTable(
  "practice_plans",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    pilotId: uuid("pilot_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    coachId: uuid("coach_id").references(() => users.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    items: jsonb("items").notNull().default([]),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("practice_plans_pilot_id_idx").on(t.pilotId)],
);

/** Launch heights read from an uploaded altimeter CSV (generic columns), matched to a session. */
export const altimeterTraces = pgTable(
  "altimeter_traces",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id").notNull().references(() => fieldSessions.id, { onDelete: "cascade" }),
    uploadedBy: uuid("uploaded_by").notNull().references(() => users.id),
    /** [{ atMs, heightM }] after parsing */
    samples: jsonb("samples").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("altimeter_traces_session_id_idx").on(t.sessionId)],
);
