import "server-only";
import { sql, type SQL } from "drizzle-orm";
import type { ClockEstimate } from "@/lib/clock";
import { ForbiddenError } from "@/lib/errors";
import { pushGate } from "@/lib/sync/push-gate";
import type { Ack, PushReply, PushRequest } from "@/lib/validations/sync";
import type { Database } from "../index";
import { devices, syncRejections } from "../schema";
import { holdDaysOfRuns, holdDaysSql } from "./club-day-locks";
import { retryAborted, sqlState } from "../retry";
import { recordReflightRequests, withdrawReflightRequests } from "./contest-reflight-requests";
import { signLanes } from "./contest-timekeepers";
import { applyDiscards } from "./run-discard";
import { derivationStatements, inlineable, seqOf, storeDerivations, type DeriveStats } from "./runs";
import { currentServerSeq, isUuid, lockAccountRunsSql, lockRuns, lockRunsSql, type Tx } from "./sync-db";
import { clockEstimateStatements, estimatesChange, movedStamps, storeClockEstimates, type StampRow } from "./sync-estimates";
import { applyRuns, applySessions, decideRuns, decideSessions, linkContestRuns, readRunFacts, runFactsSql, sessionOwnersSql, type PushContext } from "./sync-push-entities";
import { applyEvents, eventsToInsert } from "./sync-push-events";
import { loadForPush, loadSql, readLoad, type PushLoad } from "./sync-push-load";
import { pipelineTransaction, type Pipeline } from "./sync-pipeline";

/**
 * A device id belongs to the first user who pushes from it; anyone else pushing with it gets
 * 403 (their items are not looked at). Refreshes last_seen_at for the owner.
 */
export async function claimDevice(tx: Tx, deviceId: string, userId: string): Promise<void> {
  const [row] = (await tx.execute<{ user_id: string }>(claimSql(tx, deviceId, userId))).rows;
  if (row?.user_id !== userId) throw new ForbiddenError(NOT_YOUR_DEVICE);
}

const NOT_YOUR_DEVICE = "This device is registered to another account. Sign in as that account to send its records.";

/** claimDevice's statement, for a pipelined message: its row is `{ user_id }`. */
const claimSql = (tx: Tx, deviceId: string, userId: string): SQL =>
  tx.insert(devices).values({ id: deviceId, userId }).onConflictDoUpdate({ target: devices.id, set: { lastSeenAt: sql`now()` } }).returning({ userId: devices.userId }).getSQL();

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
 * Most pushes go the pipelined way (pipelinedPush below: the same statements in the same order, several to a
 * message; 2 round trips for a push of events); the rest, and any that gives up there, the careful way
 * (carefulPush). Round trips of a push that only carries events the careful way (bench/sync-profile.ts counts
 * them): begin, claim, the device's estimates, hold the runs' open club days, lock the runs, one load (runs, their
 * events, clashes, estimates: sync-push-load.ts), one multi-row insert per 500 events, one statement that stores
 * every derived lane and re-stamps the runs, commit.
 */
export async function applyPush(db: Database, userId: string, req: PushRequest, refused: readonly Ack[] = [], stats?: DeriveStats): Promise<PushReply> {
  // small pushes first: a bulk upload waits its turn here, before it takes a connection (lib/sync/push-gate.ts)
  return pushGate.run(pushItems(req), () => storePush(db, userId, req, refused, stats));
}

/** What the push gate counts: the items a push carries (its clock estimates are not items). */
export function pushItems(req: PushRequest): number {
  return req.sessions.length + req.runs.length + req.events.length + (req.discards?.length ?? 0);
}

/** One push, past the gate: the pipelined way when it can go that way, else (or when it gives up there) the careful way. */
async function storePush(db: Database, userId: string, req: PushRequest, refused: readonly Ack[], stats: DeriveStats | undefined): Promise<PushReply> {
  if (pipelines(req)) {
    let mine: DeriveStats = { resumed: 0, full: 0, reasons: [] };
    try {
      const reply = await retryAborted(() => {
        mine = { resumed: 0, full: 0, reasons: [] };
        return pipelineTransaction(db, (p) => pipelinedPush(p, userId, req, refused, mine));
      });
      if (stats) {
        stats.resumed += mine.resumed;
        stats.full += mine.full;
        stats.reasons.push(...mine.reasons);
      }
      return reply;
    } catch (error) {
      // rolled back: the push goes again the careful way
      if (!(error instanceof TakeCarefulWay) && sqlState(error) !== UNIQUE_VIOLATION) throw error;
    }
  }
  return carefulPush(db, userId, req, refused, stats);
}

/** The careful way: each step its own statement, as it needs it (any push may go this way). */
async function carefulPush(db: Database, userId: string, req: PushRequest, refused: readonly Ack[], stats?: DeriveStats): Promise<PushReply> {
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

    const refusals = refusalsSql(ctx);
    if (refusals) await tx.execute(refusals);
    const serverSeq = stillThere.length > 0 ? await storeDerivations(tx, stillThere, load.estimates, added, stats) : await currentServerSeq(tx);
    return { acks: ctx.acks, serverSeq };
  }));
}

/** The pushing device's clock estimates and (when `clubsOf` names the user) their clubs, in one read after the claim. */
async function deviceFacts(tx: Tx, deviceId: string, clubsOf: string | null): Promise<{ estimates: ClockEstimate[]; clubIds: Set<string> }> {
  return readDeviceFacts((await tx.execute<DeviceFactsRow>(deviceFactsSql(deviceId, clubsOf))).rows[0]!);
}

type DeviceFactsRow = { estimates: [number, number, number][]; clubs: string[] | null };

const deviceFactsSql = (deviceId: string, clubsOf: string | null): SQL => sql`select
    (select coalesce(json_agg(json_build_array(theta_ms, delta_ms, measured_at_wall_ms)), '[]') from device_clock_estimates where device_id = ${deviceId}) as estimates,
    ${clubsOf === null ? sql`null` : sql`(select coalesce(json_agg(club_id), '[]') from memberships where user_id = ${clubsOf})`} as clubs`;

function readDeviceFacts(row: DeviceFactsRow): { estimates: ClockEstimate[]; clubIds: Set<string> } {
  return {
    estimates: row.estimates.map(([thetaMs, deltaMs, measuredAtWallMs]) => ({ thetaMs, deltaMs, measuredAtWallMs })),
    clubIds: new Set(row.clubs ?? []),
  };
}

/** The push's refusals recorded once per device and item (null when none): both ways store them with this. */
function refusalsSql(ctx: PushContext): SQL | null {
  const rejections = new Map(ctx.acks.filter((a) => a.status === "rejected").map((a) => [a.id, a.reason ?? "rejected"]));
  if (rejections.size === 0) return null;
  return ctx.tx
    .insert(syncRejections)
    .values([...rejections].map(([itemId, reason]) => ({ itemId, deviceId: ctx.deviceId, userId: ctx.userId, reason })))
    .onConflictDoNothing({ target: [syncRejections.deviceId, syncRejections.itemId] })
    .getSQL();
}

/** Thrown inside the pipelined push when it must not go on that way: rolled back, the push goes the careful way. */
class TakeCarefulWay extends Error {}

const UNIQUE_VIOLATION = "23505";

/** Kinds whose storing writes more than the event (a contest's signed lanes, re-flight requests): the careful way. */
const MORE_THAN_THE_EVENT = new Set(["signed", "void", "reflight"]);

/**
 * Whether a push may try the pipelined way: it carries no discard (deletions go the careful way) and no
 * event whose storing writes elsewhere. Pushes that create sessions or runs are pipelined in stages (below).
 */
const pipelines = (req: PushRequest) => !req.discards?.length && !req.events.some((e) => MORE_THAN_THE_EVENT.has(e.body.kind));

/**
 * A push in as few round trips as the order of its locks allows (db/queries/sync-pipeline.ts sends several
 * statements as one message; each still reads after the ones before it), in the careful way's order:
 * 1. begin; the claim; the device's estimates (and the user's clubs, and the pushed sessions' stored owners); then,
 *    when the push creates no session or run and names no clock estimate of its own, the runs' open club days (FOR
 *    SHARE), the runs' locks and the load;
 * 2. otherwise (staged), in one message: the new estimates' writes and the read of the device's stamps they may move
 *    (clockEstimateStatements), the new sessions' insert, the account's key and the runs' facts (left out when the
 *    push creates no run and moves no stamp); then in the next: the moved stamps' updates (their runs join the
 *    locks), the runs' insert, the club days, the locks and the load;
 * 3. the events' insert (plain: a clash fails it), the refusals, the statement(s) storing every derived lane and
 *    `commit`, in one message.
 * So a push of events makes 2 round trips (9 the careful way), one that creates runs 4 (12) and a device's first
 * push (a session, a run, a new estimate) 4 (16). A push taking step 1's locks and load gives up (TakeCarefulWay:
 * rolled back, then applyPush runs it the careful way) when its events' stamps bring an estimate the server does
 * not hold (storing it may move stored events of other runs, which are then not locked); a clash of the plain insert
 * (an event some other push stored since the load) fails it and it goes the careful way too, so the event is acked
 * a duplicate or refused as before. A run of LONG_RUN_EVENTS or more stores its lanes with binary parameters after
 * the insert, then commits: one round trip more.
 */
async function pipelinedPush(p: Pipeline, userId: string, req: PushRequest, refused: readonly Ack[], stats: DeriveStats): Promise<PushReply> {
  const { tx, send } = p;
  const eventRuns = [...new Set(req.events.map((e) => e.runId).filter(isUuid))];
  const targetIds = req.events.flatMap((e) => (e.body.kind === "correct" ? [e.body.targetId] : []));
  const loadOf = (runIds: readonly string[]) => loadSql({
    runIds: [...new Set(runIds)],
    eventIds: [...new Set([...req.events.map((e) => e.id), ...targetIds])].filter(isUuid),
    deviceId: req.deviceId,
    seqs: [...new Set(req.events.map((e) => e.seq))],
  });
  const locksAndLoad = (locked: readonly string[], loaded: readonly string[]) =>
    [holdDaysSql(loaded), lockRunsSql(locked), loadOf(loaded)].filter((x): x is SQL => x !== null);
  const creates = req.sessions.length > 0 || req.runs.length > 0;
  const staged = creates || (req.clockEstimates?.length ?? 0) > 0;
  // the pushed sessions' stored owners are read in the first message too (a read by id: no lock, no order to keep)
  const owners = req.sessions.length > 0 ? [sessionOwnersSql(tx, req.sessions)] : [];
  const first = await send([claimSql(tx, req.deviceId, userId), deviceFactsSql(req.deviceId, creates ? userId : null), ...owners, ...(staged ? [] : locksAndLoad(eventRuns, eventRuns))]);
  if ((first[0]!.rows[0] as { user_id?: string } | undefined)?.user_id !== userId) throw new ForbiddenError(NOT_YOUR_DEVICE);
  const facts = readDeviceFacts(first[1]!.rows[0] as DeviceFactsRow);
  const offsets: ClockEstimate[] = req.events.flatMap((e) => (e.deviceId === req.deviceId && e.stamp.offset ? [e.stamp.offset] : []));
  const incoming = [...(req.clockEstimates ?? []), ...offsets];
  if (!staged && estimatesChange(facts.estimates, incoming)) throw new TakeCarefulWay();
  const ctx: PushContext = { tx, userId, deviceId: req.deviceId, clubIds: facts.clubIds, acks: [...refused] };

  let load: PushLoad;
  let newRuns: string[] = [];
  let moved: string[] = [];
  if (staged) {
    // the careful way's order (estimates, sessions, runs, then the days, the locks and the load) in two messages: the estimates' writes and the read of the stamps they may move, the sessions' insert, the account's
    // key and the runs' facts (read once the key is granted); the moved stamps' updates and the runs' insert go in front of
    // the days, the locks and the load (a run with a contest window: on its own, then linked)
    const clock = clockEstimateStatements(tx, req.deviceId, facts.estimates, incoming);
    const sessions = req.sessions.length > 0 ? decideSessions(ctx, req.sessions, first[2]!.rows as Parameters<typeof decideSessions>[2]).insert : null;
    let inserts = [...clock.writes, ...[sessions].filter((x): x is SQL => x !== null)];
    if (clock.read || req.runs.length > 0) {
      const checks = req.runs.length > 0 ? [lockAccountRunsSql(userId), runFactsSql(ctx, req.runs)] : [];
      const sent = await send([...clock.writes, ...(clock.read ? [clock.read] : []), ...(sessions ? [sessions] : []), ...checks]);
      inserts = [];
      if (clock.read) {
        const stamps = movedStamps(sent[clock.writes.length]!.rows as StampRow[], clock.estimates);
        moved = [...stamps.movedRuns];
        inserts.push(...stamps.updates);
      }
      if (req.runs.length > 0) {
        const runs = decideRuns(ctx, req.runs, readRunFacts(sent.at(-1)!.rows[0] as Parameters<typeof readRunFacts>[0]));
        newRuns = runs.newRuns;
        if (runs.insert) inserts.push(runs.insert);
        if (runs.insert && req.runs.some((r) => r.contest)) {
          await send(inserts);
          inserts = [];
          await linkContestRuns(ctx, req.runs, newRuns);
        }
      }
    }
    const locked = await send([...inserts, ...locksAndLoad([...eventRuns, ...moved], [...eventRuns, ...moved, ...newRuns])]);
    load = readLoad(locked.at(-1)!.rows as Parameters<typeof readLoad>[0]);
  } else {
    load = readLoad(first.at(-1)!.rows as Parameters<typeof readLoad>[0]);
  }

  const { insert, added } = eventsToInsert(ctx, req.events, load);
  const refusals = refusalsSql(ctx);
  const writes = [insert, refusals].filter((x): x is SQL => x !== null);
  const derive = [...load.runs.values()].filter((r) => added.has(r.id) || moved.includes(r.id) || newRuns.includes(r.id));
  if (derive.length > 0 && !inlineable(derive)) {
    // a long run's lanes go as binary parameters, after the insert (they then read its events from the table)
    if (writes.length > 0) await send(writes);
    return { acks: ctx.acks, serverSeq: await storeDerivations(tx, derive, load.estimates, added, stats) };
  }
  const stores = derive.length === 0 ? [sql`select last_value, is_called from sync_seq`]
    : await derivationStatements(tx, derive, load.estimates, added, { stats, inline: true, stored: false });
  const done = await send([...writes, ...stores], { commit: true });
  return { acks: ctx.acks, serverSeq: seqOf(done.at(-1)!.rows[0] as { last_value: string; is_called: boolean } | undefined) };
}
