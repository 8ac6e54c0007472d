import { type AnyPgColumn, index, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { fieldSessions, runs } from "./sessions";
import { users } from "./users";

/**
 * A coach's note on a pilot's session or run, and the answers to it: a thread is one note with
 * `reply_to` null (written by the coach) and its answers (`reply_to` its id, written by the pilot
 * or the same coach). `pilot_id` and `coach_id` name the thread's two people on every row, so who
 * may read a row is decided by them alone (the pilot, or the coach while the pilot's grant holds).
 */
export const coachNotes = pgTable(
  "coach_notes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id").notNull().references(() => fieldSessions.id, { onDelete: "cascade" }),
    /** null: a note on the whole session */
    runId: uuid("run_id").references(() => runs.id, { onDelete: "cascade" }),
    pilotId: uuid("pilot_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    coachId: uuid("coach_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    authorId: uuid("author_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    replyTo: uuid("reply_to").references((): AnyPgColumn => coachNotes.id, { onDelete: "cascade" }),
    body: text("body").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("coach_notes_session_id_idx").on(t.sessionId),
    index("coach_notes_pilot_id_idx").on(t.pilotId),
    index("coach_notes_coach_id_idx").on(t.coachId),
    index("coach_notes_reply_to_idx").on(t.replyTo),
  ],
);

export { practicePlans } from "./practice-plans";

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

/**
 * A pilot's offer of their season to a coach, by e-mail or by a one-time code, before the coach
 * takes it up: accepting turns it into a coach_grants row. An e-mail offer waits for the account
 * with that address (existing or not: the pilot is never told which); a code offer is held only
 * as its SHA-256 and expires.
 */
export const coachInvites = pgTable(
  "coach_invites",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    pilotId: uuid("pilot_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    /** lower-case; null for a code offer */
    email: text("email"),
    /** hex SHA-256 of the code; null for an e-mail offer */
    codeHash: text("code_hash"),
    expiresAt: timestamp("expires_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [
    index("coach_invites_pilot_id_idx").on(t.pilotId),
    index("coach_invites_email_idx").on(t.email),
    uniqueIndex("coach_invites_code_hash_uq").on(t.codeHash),
  ],
);
