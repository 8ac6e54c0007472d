import { boolean, doublePrecision, index, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { clubRoleEnum } from "./enums";
import { users } from "./users";

export const clubs = pgTable("clubs", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  slug: text("slug").notNull().unique(),
  homeField: text("home_field"),
  /** The club's IANA time zone (checked with Intl): a field day is a date on the club's own clock. */
  timeZone: text("time_zone").notNull().default("UTC"),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export const memberships = pgTable(
  "memberships",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    clubId: uuid("club_id").notNull().references(() => clubs.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    role: clubRoleEnum("role").notNull().default("member"),
    /** The member asked for the summary e-mail of each field day this club closes (off until they turn it on). */
    daySummaries: boolean("day_summaries").notNull().default(false),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("memberships_club_user_uq").on(t.clubId, t.userId), index("memberships_user_id_idx").on(t.userId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    clubId: uuid("club_id").notNull().references(() => clubs.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: clubRoleEnum("role").notNull().default("member"),
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: uuid("invited_by").notNull().references(() => users.id),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    /** Who used the link (the invited address may differ from the account's: the link is the credential). */
    acceptedBy: uuid("accepted_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("invitations_club_id_idx").on(t.clubId)],
);

/**
 * A field the club flies at, with what anyone flying there should know: shown as cautions beside the
 * usual safety notes (the field's own rules and the law come first), on the club's home and on the
 * Field screen's set-up form when the pilot names this field.
 */
export const clubFields = pgTable(
  "club_fields",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    clubId: uuid("club_id").notNull().references(() => clubs.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    latitude: doublePrecision("latitude"),
    longitude: doublePrecision("longitude"),
    launchDirection: text("launch_direction"),
    safetyAreas: text("safety_areas"),
    localRules: text("local_rules"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("club_fields_club_name_uq").on(t.clubId, t.name)],
);

/** A pilot lets a coach read their season; revoking keeps the row for the record. */
export const coachGrants = pgTable(
  "coach_grants",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    pilotId: uuid("pilot_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    coachId: uuid("coach_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [index("coach_grants_coach_id_idx").on(t.coachId), index("coach_grants_pilot_id_idx").on(t.pilotId)],
);
