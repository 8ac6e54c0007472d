import "server-only";
import { sql } from "drizzle-orm";
import type { ClockEstimate } from "@/lib/clock";
import { ForbiddenError } from "@/lib/errors";
import { pushGate } from "@/lib/sync/push-gate";
import type { Ack, PushReply, PushRequest } from "@/lib/validations/sync";
import type { Database } from "../index";
import { devices, syncRejections } from "../schema";
import { holdDaysOfRuns } from "./club-day-locks";
import { retryAborted } from "../retry";
import { recordReflightRequests, withdrawReflightRequests } from "./contest-reflight-requests";
import { signLanes } from "./contest-timekeepers";
import { applyDiscards } from "./run-discard";
import { storeDerivations, type DeriveStats } from "./runs";
import { currentServerSeq, isUuid, lockRuns, type Tx } from "./sync-db";
import { storeClockEstimates } from "./sync-estimates";
import { applyRuns, applySessions, type PushContext } from "./sync-push-entities";
import { applyEvents } from "./sync-push-events";
import { loadForPush } from "./sync-push-load";

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
 * locked, all at once and in id order (lockRuns), before anything about them is read — after the
 * open club days those runs and the deleted ones may belong to are held FOR SHARE (holdDaysOfRuns),
 * the order in which a day's close takes them. Refusals —
 * `refused`, the items that failed their schema, and those refused here — are acknowledged with
 * their reason and recorded in sync_rejections once per device and item. Returns one ack per
 * item and the last server sequence number.
 *
 * Round trips of a push that only carries events (bench/sync-profile.ts counts them): begin,
 * claim, the device's estimates, hold the runs' open club days, lock the runs, one load (runs, their events, clashes, estimates:
 * sync-push-load.ts), one multi-row insert per 500 events, one statement that stores every
 * derived lane and re-stamps the runs, commit.
 */
export async function applyPush(db: Database, userId: string, req: PushRequest, refused: readonly Ack[] = [], stats?: DeriveStats): Promise<PushReply> {
  // small pushes first: a bulk upload waits its turn here, before it takes a connection (lib/sync/push-gate.ts)
  return pushGate.run(pushItems(req), () => storePush(db, userId, req, refused, stats));
}

/** What the push gate counts: the items a push carries (its clock estimates are not items). */
export function pushItems(req: PushRequest): number {
  return req.sessions.length + req.runs.length + req.events.length + (req.discards?.length ?? 0);
}

function storePush(db: Database, userId: string, req: PushRequest, refused: readonly Ack[], stats: DeriveStats | undefined): Promise<PushReply> {
  // a transaction PostgreSQL aborted (a deadlock between two pushes) is run again whole (db/retry.ts)
  return retryAborted(() => db.transaction(async (tx) => {
    await claimDevice(tx, req.deviceId, userId);
    const needsClubs = req.sessions.length > 0 || req.runs.length > 0;
    const start = await deviceFacts(tx, req.deviceId, needsClubs ? userId : null);
    const ctx: PushContext = { tx, userId, deviceId: req.deviceId, clubIds: start.clubIds, acks: [...refused] };

    const offsets: ClockEstimate[] = req.events.flatMap((e) => (e.deviceId === req.deviceId && e.stamp.offset ? [e.stamp.offset] : []));
    const clock = await storeClockEstimates(tx, req.deviceId, [...(req.clockEstimates ?? []), ...offsets], start.estimates);

    await applySessions(ctx, req.sessions);
    const newRuns = await applyRuns(ctx, req.runs);
    const eventRuns = req.events.map((e) => e.runId).filter(isUuid);
    const discardIds = (req.discards ?? []).map((d) => d.id).filter(isUuid);
    // the open club days of every run this push writes or deletes, before any run is locked: the close's order (club-day-locks.ts)
    await holdDaysOfRuns(tx, [...eventRuns, ...clock.movedRuns, ...newRuns, ...discardIds]);
    await lockRuns(tx, [...eventRuns, ...clock.movedRuns]);
    const targetIds = req.events.flatMap((e) => (e.body.kind === "void" || e.body.kind === "correct" ? [e.body.targetId] : []));
    const load = await loadForPush(tx, {
      runIds: [...new Set([...eventRuns, ...clock.movedRuns, ...newRuns])],
      eventIds: [...new Set([...req.events.map((e) => e.id), ...targetIds])].filter(isUuid),
      deviceId: req.deviceId,
      seqs: [...new Set(req.events.map((e) => e.seq))],
    });
    const added = await applyEvents(ctx, req.events, load);
    // a contest timekeeper's phone: pilot and timekeeper signed (or undid a signature of) lanes of a run linked to contest slots
    const signs = req.events.filter((e) => (e.body.kind === "signed" || e.body.kind === "void") && added.has(e.runId));
    if (signs.length > 0) await signLanes(tx, userId, signs);
    // a `reflight` ruling on a contest duty's lane: a re-flight request for the officer (granting it is theirs, F3K.9.6)
    const applied = new Set(ctx.acks.filter((a) => a.status === "applied").map((a) => a.id));
    const asks = req.events.filter((e) => e.body.kind === "reflight" && applied.has(e.id));
    if (asks.length > 0) await recordReflightRequests(tx, userId, asks);
    const undos = req.events.filter((e) => e.body.kind === "void" && applied.has(e.id));
    if (undos.length > 0) await withdrawReflightRequests(tx, userId, undos);
    const derive = [...load.runs.values()].filter((r) => added.has(r.id) || clock.movedRuns.has(r.id) || newRuns.includes(r.id));
    if (req.discards?.length) await applyDiscards(ctx, req.discards); // after the events: a run set up and deleted in one push goes too
    const deleted = new Set(ctx.acks.filter((a) => a.status === "applied" && req.discards?.some((d) => d.id === a.id)).map((a) => a.id));
    const stillThere = derive.filter((r) => !deleted.has(r.id));

    const rejections = new Map(ctx.acks.filter((a) => a.status === "rejected").map((a) => [a.id, a.reason ?? "rejected"]));
    if (rejections.size > 0) {
      await tx
        .insert(syncRejections)
        .values([...rejections].map(([itemId, reason]) => ({ itemId, deviceId: req.deviceId, userId, reason })))
        .onConflictDoNothing({ target: [syncRejections.deviceId, syncRejections.itemId] });
    }
    const serverSeq = stillThere.length > 0 ? await storeDerivations(tx, stillThere, load.estimates, added, stats) : await currentServerSeq(tx);
    return { acks: ctx.acks, serverSeq };
  }));
}

/** The pushing device's clock estimates and (when `clubsOf` names the user) their clubs, in one read after the claim. */
async function deviceFacts(tx: Tx, deviceId: string, clubsOf: string | null): Promise<{ estimates: ClockEstimate[]; clubIds: Set<string> }> {
  const r = await tx.execute<{ estimates: [number, number, number][]; clubs: string[] | null }>(sql`select
    (select coalesce(json_agg(json_build_array(theta_ms, delta_ms, measured_at_wall_ms)), '[]') from device_clock_estimates where device_id = ${deviceId}) as estimates,
    ${clubsOf === null ? sql`null` : sql`(select coalesce(json_agg(club_id), '[]') from memberships where user_id = ${clubsOf})`} as clubs`);
  const row = r.rows[0]!;
  return {
    estimates: row.estimates.map(([thetaMs, deltaMs, measuredAtWallMs]) => ({ thetaMs, deltaMs, measuredAtWallMs })),
    clubIds: new Set(row.clubs ?? []),
  };
}
