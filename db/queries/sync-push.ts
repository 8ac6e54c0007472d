import "server-only";
import { sql } from "drizzle-orm";
import type { ClockEstimate } from "@/lib/clock";
import { ForbiddenError } from "@/lib/errors";
import type { PushReply, PushRequest } from "@/lib/validations/sync";
import type { Database } from "../index";
import { devices, syncRejections } from "../schema";
import { deriveAndStoreRuns } from "./runs";
import { currentServerSeq, lockSync, type Tx } from "./sync-db";
import { storeClockEstimates } from "./sync-estimates";
import { applyRuns, applySessions, listUserClubIds, type PushContext } from "./sync-push-entities";
import { applyEvents } from "./sync-push-events";

/**
 * A device id belongs to the first user who pushes from it; anyone else pushing with it gets
 * 403 (their items are not looked at). Refreshes last_seen_at for the owner.
 */
export async function claimDevice(tx: Tx, deviceId: string, userId: string): Promise<void> {
  const [row] = await tx
    .insert(devices)
    .values({ id: deviceId, userId })
    .onConflictDoUpdate({ target: devices.id, set: { lastSeenAt: sql`now()` } })
    .returning({ userId: devices.userId });
  if (row?.userId !== userId) throw new ForbiddenError("This device is registered to another account. Sign in as that account to send its records.");
}

/**
 * Apply one push (SYNC.md §3) in ONE transaction: claim the device, take the sync lock (so
 * server_seq values commit in order), store clock estimates and re-correct what they move,
 * then sessions, runs and events — each checked, each stored once — then re-derive every
 * affected run's results. Refusals are acknowledged with their reason and recorded in
 * sync_rejections. Returns one ack per item and the last server sequence number.
 */
export async function applyPush(db: Database, userId: string, req: PushRequest): Promise<PushReply> {
  return db.transaction(async (tx) => {
    await claimDevice(tx, req.deviceId, userId);
    await lockSync(tx);
    const needsClubs = req.sessions.length > 0 || req.runs.length > 0;
    const clubIds = needsClubs ? await listUserClubIds(tx, userId) : new Set<string>();
    const ctx: PushContext = { tx, userId, deviceId: req.deviceId, clubIds, acks: [] };

    const offsets: ClockEstimate[] = req.events.flatMap((e) => (e.deviceId === req.deviceId && e.stamp.offset ? [e.stamp.offset] : []));
    const clock = await storeClockEstimates(tx, req.deviceId, [...(req.clockEstimates ?? []), ...offsets]);

    await applySessions(ctx, req.sessions);
    const newRuns = await applyRuns(ctx, req.runs);
    const touched = await applyEvents(ctx, req.events, clock.estimates);
    await deriveAndStoreRuns(tx, [...newRuns, ...touched, ...clock.movedRuns]);

    const refused = ctx.acks.filter((a) => a.status === "rejected");
    if (refused.length > 0) {
      await tx.insert(syncRejections).values(
        refused.map((a) => ({ itemId: a.id, deviceId: req.deviceId, userId, reason: a.reason ?? "rejected" })),
      );
    }
    return { acks: ctx.acks, serverSeq: await currentServerSeq(tx) };
  });
}
