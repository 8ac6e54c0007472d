import "server-only";
import { and, eq, inArray, isNotNull, ne, notExists, or, sql } from "drizzle-orm";
import type { Database } from "../index";
import {
  accounts, coachGrants, coachInvites, emailTokens, coachNotes, contestEntries, devices, fieldSessions, laneConsents, memberships, practicePlans, runDeletions, runLanes, runs,
  syncRejections, users, altimeterLogs, loggerMappings, models,
} from "../schema";
import { syncStamp } from "./sync-db";

/** The neutral name that replaces a deleted account's name wherever others' records keep it. */
export const DELETED_PILOT_NAME = "Deleted pilot";

/**
 * Deletes an account the way its owner asked, keeping what other people's records need:
 * - removed: memberships, coach grants (both ways), devices and their clock data, sign-in
 *   methods, sync rejections, its models, altimeter logs and logger mappings, its consent decisions, the practice plans it received, the coach notes it wrote, and every
 *   run in its own sessions that no other account flies in (events and lanes go with them), then
 *   its sessions left empty;
 * - its id in the deletions of windows it could see (`run_deletions.seen_by`, and `deleted_by`
 *   when it deleted the window): nobody is left to tell, and no row keeps the id;
 * - kept without the name: runs where another account flies a lane (with their session), lanes
 *   it flew in others' runs (the result stays under "Deleted pilot"), contest entries (results
 *   need them), events it recorded in kept runs, rows it created for a club;
 * - the user row stays as an anonymous tombstone (runs.created_by, events.recorded_by and others
 *   reference it without cascade): e-mail freed, name "Deleted pilot", no password, disabled, new
 *   session generation, so every session of the account is signed out at once.
 * Runs whose lanes changed are re-stamped (syncStamp), so other phones pull the neutral name.
 * Returns false when the account did not exist (or was already deleted).
 */
export async function deleteAccount(db: Database, userId: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [me] = await tx.select({ id: users.id }).from(users).where(and(eq(users.id, userId), sql`${users.deletedAt} is null`)).for("update");
    if (!me) return false;
    const ownSessions = tx.select({ id: fieldSessions.id }).from(fieldSessions).where(eq(fieldSessions.ownerId, userId));
    const othersLane = tx
      .select({ one: sql`1` })
      .from(runLanes)
      .where(and(eq(runLanes.runId, runs.id), isNotNull(runLanes.pilotUserId), ne(runLanes.pilotUserId, userId)));
    await tx.delete(runs).where(and(inArray(runs.sessionId, ownSessions), notExists(othersLane)));
    await tx
      .delete(fieldSessions)
      .where(and(eq(fieldSessions.ownerId, userId), notExists(tx.select({ one: sql`1` }).from(runs).where(eq(runs.sessionId, fieldSessions.id)))));
    await tx.delete(laneConsents).where(eq(laneConsents.pilotUserId, userId)); // its lanes become anonymous below
    const touched = await tx
      .update(runLanes)
      .set({ pilotUserId: null, pilotName: DELETED_PILOT_NAME })
      .where(eq(runLanes.pilotUserId, userId))
      .returning({ runId: runLanes.runId });
    const runIds = [...new Set(touched.map((t) => t.runId))];
    if (runIds.length) await tx.update(runs).set(syncStamp()).where(inArray(runs.id, runIds));
    await tx
      .update(runDeletions)
      .set({
        seenBy: sql`array_remove(${runDeletions.seenBy}, ${userId}::uuid)`,
        deletedBy: sql`nullif(${runDeletions.deletedBy}, ${userId}::uuid)`,
      })
      .where(or(sql`${userId}::uuid = any(${runDeletions.seenBy})`, eq(runDeletions.deletedBy, userId)));
    await tx.update(contestEntries).set({ pilotName: DELETED_PILOT_NAME }).where(eq(contestEntries.pilotUserId, userId));
    await tx.update(practicePlans).set({ coachId: null }).where(eq(practicePlans.coachId, userId));
    await tx.delete(practicePlans).where(eq(practicePlans.pilotId, userId));
    await tx.delete(coachNotes).where(eq(coachNotes.coachId, userId));
    await tx.delete(coachInvites).where(eq(coachInvites.pilotId, userId));
    await tx.delete(coachGrants).where(or(eq(coachGrants.pilotId, userId), eq(coachGrants.coachId, userId)));
    await tx.delete(memberships).where(eq(memberships.userId, userId));
    await tx.delete(devices).where(eq(devices.userId, userId));
    await tx.delete(accounts).where(eq(accounts.userId, userId));
    await tx.delete(syncRejections).where(eq(syncRejections.userId, userId));
    // the hangar and altimeter logs are the pilot's own (the route deletes the log files from storage)
    await tx.delete(altimeterLogs).where(eq(altimeterLogs.ownerId, userId));
    await tx.delete(loggerMappings).where(eq(loggerMappings.ownerId, userId));
    await tx.delete(models).where(eq(models.ownerId, userId));
    await tx.delete(emailTokens).where(eq(emailTokens.userId, userId)); // no link may act on the tombstone
    await tx
      .update(users)
      .set({
        email: sql`'deleted-' || ${users.id}::text || '@deleted.invalid'`,
        name: DELETED_PILOT_NAME,
        passwordHash: null,
        emailVerifiedAt: null,
        role: "member",
        disabledAt: sql`now()`,
        deletedAt: sql`now()`,
        sessionVersion: sql`${users.sessionVersion} + 1`,
      })
      .where(eq(users.id, userId));
    return true;
  });
}
