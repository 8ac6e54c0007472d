import "server-only";
import { sql } from "drizzle-orm";
import type { ClockEstimate } from "@/lib/clock";
import { ForbiddenError } from "@/lib/errors";
import type { Ack, PushReply, PushRequest } from "@/lib/validations/sync";
import type { Database } from "../index";
import { devices, syncRejections } from "../schema";
import { applyDiscards } from "./run-discard";
import { deriveAndStoreRuns } from "./runs";
import { currentServerSeq, isUuid, lockRuns, type Tx } from "./sync-db";
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
 * Apply one push (SYNC.md §3) in ONE transaction: claim the device (its row lock makes one
 * device's pushes take turns), store clock estimates and re-correct what they move, then
 * sessions, runs and events — each checked, each stored once — then derive every affected run
 * once. No lock is shared by all pushes: the rows carry this transaction's id (pulls serve only
 * finished transactions, db/queries/sync-pull.ts), and only the runs this push writes to are
 * locked, all at once and in id order (lockRuns), before their events are counted and stored. Refusals — `refused`, the items that failed their schema, and those
 * refused here — are acknowledged with their reason and recorded in sync_rejections once per
 * device and item. Returns one ack per item and the last server sequence number.
 */
export async function applyPush(db: Database, userId: string, req: PushRequest, refused: readonly Ack[] = []): Promise<PushReply> {
  return db.transaction(async (tx) => {
    await claimDevice(tx, req.deviceId, userId);
    const needsClubs = req.sessions.length > 0 || req.runs.length > 0;
    const clubIds = needsClubs ? await listUserClubIds(tx, userId) : new Set<string>();
    const ctx: PushContext = { tx, userId, deviceId: req.deviceId, clubIds, acks: [...refused] };

    const offsets: ClockEstimate[] = req.events.flatMap((e) => (e.deviceId === req.deviceId && e.stamp.offset ? [e.stamp.offset] : []));
    const clock = await storeClockEstimates(tx, req.deviceId, [...(req.clockEstimates ?? []), ...offsets]);

    await applySessions(ctx, req.sessions);
    const newRuns = await applyRuns(ctx, req.runs);
    await lockRuns(tx, [...req.events.map((e) => e.runId).filter(isUuid), ...clock.movedRuns]);
    const touched = await applyEvents(ctx, req.events, clock.estimates);
    await deriveAndStoreRuns(tx, [...newRuns, ...touched, ...clock.movedRuns]);
    if (req.discards?.length) await applyDiscards(ctx, req.discards); // last: a run set up and deleted in one push goes too

    const rejections = new Map(ctx.acks.filter((a) => a.status === "rejected").map((a) => [a.id, a.reason ?? "rejected"]));
    if (rejections.size > 0) {
      await tx
        .insert(syncRejections)
        .values([...rejections].map(([itemId, reason]) => ({ itemId, deviceId: req.deviceId, userId, reason })))
        .onConflictDoNothing({ target: [syncRejections.deviceId, syncRejections.itemId] });
    }
    return { acks: ctx.acks, serverSeq: await currentServerSeq(tx) };
  });
}
