import "server-only";
import { asc, count, desc, eq, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { Database } from "../index";
import { adminActions, clubs, mailQueue, memberships, syncRejections, users } from "../schema";

/** How many rows each admin list shows: the newest first. */
export const ADMIN_LIST_LIMIT = 50;

/** Every club with its number of members (officers and coaches included), by name. Read only. */
export async function listClubsWithCounts(db: Database) {
  return db
    .select({ id: clubs.id, name: clubs.name, slug: clubs.slug, homeField: clubs.homeField, createdAt: clubs.createdAt, members: count(memberships.id) })
    .from(clubs)
    .leftJoin(memberships, eq(memberships.clubId, clubs.id))
    .groupBy(clubs.id)
    .orderBy(asc(clubs.name), asc(clubs.slug));
}

/**
 * The e-mail queue, messages needing attention (unsent with an error) first, then the newest. Never
 * the bodies: they hold one-time links that are their addressee's alone.
 */
export async function listMailQueue(db: Database) {
  return db
    .select({
      id: mailQueue.id, to: mailQueue.to, subject: mailQueue.subject, kind: mailQueue.kind, attempts: mailQueue.attempts,
      nextAttemptAt: mailQueue.nextAttemptAt, sentAt: mailQueue.sentAt, lastError: mailQueue.lastError, createdAt: mailQueue.createdAt,
    })
    .from(mailQueue)
    .orderBy(sql`(${mailQueue.sentAt} is null and ${mailQueue.lastError} is not null) desc`, desc(mailQueue.createdAt))
    .limit(ADMIN_LIST_LIMIT);
}

/** Pushed items the server refused, newest first, with the account that pushed them. */
export async function listSyncRejections(db: Database) {
  return db
    .select({
      id: syncRejections.id, deviceId: syncRejections.deviceId, itemId: syncRejections.itemId, reason: syncRejections.reason,
      createdAt: syncRejections.createdAt, userEmail: users.email,
    })
    .from(syncRejections)
    .leftJoin(users, eq(users.id, syncRejections.userId))
    .orderBy(desc(syncRejections.createdAt))
    .limit(ADMIN_LIST_LIMIT);
}

const actor = alias(users, "actor");
const target = alias(users, "target");

/** The admin audit log, newest first: who did what to whom, and when. */
export async function listAdminActions(db: Database) {
  return db
    .select({
      id: adminActions.id, action: adminActions.action, detail: adminActions.detail, createdAt: adminActions.createdAt,
      actorEmail: actor.email, actorName: actor.name, targetEmail: target.email, targetMailTo: mailQueue.to,
    })
    .from(adminActions)
    .leftJoin(actor, eq(actor.id, adminActions.actorId))
    .leftJoin(target, eq(target.id, adminActions.targetUserId))
    .leftJoin(mailQueue, eq(mailQueue.id, adminActions.targetMailId))
    .orderBy(desc(adminActions.createdAt), desc(adminActions.id))
    .limit(ADMIN_LIST_LIMIT);
}
