import { index, jsonb, pgEnum, pgTable, timestamp, uuid } from "drizzle-orm/pg-core";
import { mailQueue } from "./mail";
import { users } from "./users";

/** What a site admin did (db/queries/admin-users.ts, admin-mail.ts). */
export const adminActionEnum = pgEnum("admin_action", ["user.disable", "user.enable", "user.role", "mail.retry"]);

/** What an audit entry remembers beyond who, what and when: the role before and after, a message's attempts before a retry. */
export type AdminActionDetail = { fromRole?: "member" | "admin"; toRole?: "member" | "admin"; attempts?: number };

/**
 * The admin audit log: every admin action, written in the same transaction as the change it records,
 * so there is no change without its entry and no entry without its change. Rows are never updated.
 */
export const adminActions = pgTable(
  "admin_actions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** Who acted (a deleted admin stays as its anonymous tombstone row; null only if the row itself went). */
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: adminActionEnum("action").notNull(),
    targetUserId: uuid("target_user_id").references(() => users.id, { onDelete: "set null" }),
    targetMailId: uuid("target_mail_id").references(() => mailQueue.id, { onDelete: "set null" }),
    detail: jsonb("detail").$type<AdminActionDetail>().notNull().default({}),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("admin_actions_created_at_idx").on(t.createdAt), index("admin_actions_target_user_id_idx").on(t.targetUserId)],
);
