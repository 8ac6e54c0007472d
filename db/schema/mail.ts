import { index, integer, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";

/**
 * Outgoing e-mail, sent by lib/mail/server/drain.ts through SMTP. A request only inserts a row, so it never
 * waits on the mail server; a failed send stays here with `last_error` and is tried again at
 * `next_attempt_at` (backoff), until `sent_at` is set or the attempts run out.
 */
export const mailQueue = pgTable(
  "mail_queue",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    to: text("to").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    /** Which message this is (lib/mail/messages.ts), for the admin's queue view and tests. */
    kind: text("kind").notNull(),
    attempts: integer("attempts").notNull().default(0),
    /** When the next send may start; null once given up. A claimed row is moved ahead by a lease. */
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    lastError: text("last_error"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("mail_queue_due_idx").on(t.nextAttemptAt)],
);

/**
 * One-time links sent by e-mail: verify an address, reset a password, confirm a new address. Only the
 * SHA-256 of the token is stored; `used_at` makes it single use; `new_email` is the address a change
 * confirms.
 */
export const emailTokens = pgTable(
  "email_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    purpose: text("purpose").$type<"verify" | "reset" | "change-email">().notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    newEmail: text("new_email"),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("email_tokens_user_id_idx").on(t.userId)],
);
