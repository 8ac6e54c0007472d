import "server-only";
import { asc, count, desc, eq, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { Database } from "../index";
import { adminActions, clubs, mailQueue, memberships, syncRejections, users } from "../schema";

/** How many rows each admin list shows on a page: the newest first. */
export const ADMIN_LIST_LIMIT = 50;

/** One page (from 1) of a list: its rows and whether an older page follows. */
export type AdminPage<T> = { rows: T[]; page: number; more: boolean };

/** Reads one row past the page to tell whether another page follows. */
async function paged<T>(page: number, read: (limit: number, offset: number) => Promise<T[]>): Promise<AdminPage<T>> {
  const rows = await read(ADMIN_LIST_LIMIT + 1, (page - 1) * ADMIN_LIST_LIMIT);
  return { rows: rows.slice(0, ADMIN_LIST_LIMIT), page, more: rows.length > ADMIN_LIST_LIMIT };
}

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
export async function listMailQueue(db: Database, page = 1) {
  return paged(page, (limit, offset) => db
    .select({
      id: mailQueue.id, to: mailQueue.to, subject: mailQueue.subject, kind: mailQueue.kind, attempts: mailQueue.attempts,
      nextAttemptAt: mailQueue.nextAttemptAt, sentAt: mailQueue.sentAt, lastError: mailQueue.lastError, createdAt: mailQueue.createdAt,
    })
    .from(mailQueue)
    .orderBy(sql`(${mailQueue.sentAt} is null and ${mailQueue.lastError} is not null) desc`, desc(mailQueue.createdAt), desc(mailQueue.id))
    .limit(limit).offset(offset));
}

/** Pushed items the server refused, newest first, with the account that pushed them. */
export async function listSyncRejections(db: Database, page = 1) {
  return paged(page, (limit, offset) => db
    .select({
      id: syncRejections.id, deviceId: syncRejections.deviceId, itemId: syncRejections.itemId, reason: syncRejections.reason,
      createdAt: syncRejections.createdAt, userEmail: users.email,
    })
    .from(syncRejections)
    .leftJoin(users, eq(users.id, syncRejections.userId))
    .orderBy(desc(syncRejections.createdAt), desc(syncRejections.id))
    .limit(limit).offset(offset));
}

const actor = alias(users, "actor");
const target = alias(users, "target");

/** The admin audit log, newest first: who did what to whom, and when. */
export async function listAdminActions(db: Database, page = 1) {
  return paged(page, (limit, offset) => db
    .select({
      id: adminActions.id, action: adminActions.action, detail: adminActions.detail, createdAt: adminActions.createdAt,
      actorEmail: actor.email, actorName: actor.name, targetEmail: target.email, targetMailTo: mailQueue.to,
    })
    .from(adminActions)
    .leftJoin(actor, eq(actor.id, adminActions.actorId))
    .leftJoin(target, eq(target.id, adminActions.targetUserId))
    .leftJoin(mailQueue, eq(mailQueue.id, adminActions.targetMailId))
    .orderBy(desc(adminActions.createdAt), desc(adminActions.id))
    .limit(limit).offset(offset));
}
