import { index, integer, pgTable, primaryKey, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { globalRoleEnum } from "./enums";

export const users = pgTable("users", {
  id: uuid("id").primaryKey().defaultRandom(),
  email: text("email").notNull().unique(), // stored lower-case
  name: text("name").notNull(),
  passwordHash: text("password_hash"),
  role: globalRoleEnum("role").notNull().default("member"),
  /** Set when an admin disables the account or its owner deletes it: it can no longer sign in or act. */
  disabledAt: timestamp("disabled_at", { withTimezone: true }),
  /** Set when the owner deleted the account: the row stays as an anonymous tombstone (lib/auth/session.ts). */
  deletedAt: timestamp("deleted_at", { withTimezone: true }),
  /** Session generation: every session token carries the value it was issued under; bumping it signs all of them out. */
  sessionVersion: integer("session_version").notNull().default(0),
  /** When the owner followed the link mailed to this address; null = not verified (the account works anyway). */
  emailVerifiedAt: timestamp("email_verified_at", { withTimezone: true }),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Sign-in methods other than a password (kept for later providers; shaped like Auth.js accounts). */
export const accounts = pgTable(
  "accounts",
  {
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    provider: text("provider").notNull(),
    providerAccountId: text("provider_account_id").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.provider, t.providerAccountId] }), index("accounts_user_id_idx").on(t.userId)],
);

/** A pilot timed without an account: a named guest, claimable later by a user. */
export const guestPilots = pgTable(
  "guest_pilots",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    createdBy: uuid("created_by").notNull().references(() => users.id),
    claimedBy: uuid("claimed_by").references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("guest_pilots_created_by_idx").on(t.createdBy)],
);
