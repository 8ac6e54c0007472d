import "server-only";
import { inArray, sql } from "drizzle-orm";
import type { ClockEstimate } from "@/lib/clock";
import type { EventBody } from "@/lib/events/schema";
import { deriveRun, type DerivationEvent } from "@/lib/sync/derive";
import { uncertaintyOf } from "@/lib/sync/correct-events";
import { parseTaskDefinition } from "@/lib/tasks";
import { deviceClockEstimates, events, runs } from "../schema";
import { currentServerSeq, lockRuns, type Tx } from "./sync-db";
import { loadForPush, type LoadedRun } from "./sync-push-load";

type EventRow = typeof events.$inferSelect;

/** A stored event row as the derivation reads it (raw stamp, corrected time, bound). */
export function toDerivationEvent(row: EventRow): DerivationEvent {
  const offset =
    row.offsetThetaMs !== null && row.offsetDeltaMs !== null && row.offsetMeasuredAtMs !== null
      ? { thetaMs: row.offsetThetaMs, deltaMs: row.offsetDeltaMs, measuredAtWallMs: row.offsetMeasuredAtMs }
      : null;
  return {
    id: row.id,
    deviceId: row.deviceId,
    seq: row.seq,
    recordedBy: row.recordedBy,
    stamp: { wallMs: row.wallMs, monoMs: row.monoMs, pageId: row.pageId, offset },
    body: row.body as EventBody,
    correctedMs: row.correctedMs,
    uncertaintyMs: uncertaintyOf(row.uncertaintyMs),
  };
}

/** Every clock estimate of the given devices, by device. */
export async function listDeviceEstimates(tx: Tx, deviceIds: readonly string[]): Promise<Map<string, ClockEstimate[]>> {
  const out = new Map<string, ClockEstimate[]>();
  if (deviceIds.length === 0) return out;
  const rows = await tx.select().from(deviceClockEstimates).where(inArray(deviceClockEstimates.deviceId, [...deviceIds]));
  for (const r of rows) {
    const list = out.get(r.deviceId) ?? [];
    list.push({ thetaMs: r.thetaMs, deltaMs: r.deltaMs, measuredAtWallMs: r.measuredAtWallMs });
    out.set(r.deviceId, list);
  }
  return out;
}

/**
 * Timekeepers a contest assigned to a run: the only official recorders (lib/sync/sources.ts).
 * Contests do not assign timekeepers yet (db/schema/contests.ts), so no record is official;
 * the contest work replaces this with a lookup per run.
 */
const NO_OFFICIALS: ReadonlySet<string> = new Set();

/**
 * Re-derive the results of these runs from their stored events (lib/sync/derive.ts) and store
 * them (storeDerivations). Locks the runs' rows (lockRuns) first, so a concurrent writer of the
 * same run waits and then derives from everything committed — nothing else is locked. A push
 * does not come here: it locks, loads and derives its runs itself (db/queries/sync-push.ts).
 */
export async function deriveAndStoreRuns(tx: Tx, runIds: Iterable<string>): Promise<void> {
  const ids = [...new Set(runIds)];
  if (ids.length === 0) return;
  await lockRuns(tx, ids);
  const load = await loadForPush(tx, { runIds: ids, eventIds: [], deviceId: "", seqs: [] });
  await storeDerivations(tx, [...load.runs.values()], load.estimates);
}

/**
 * Derive each of these runs once, from its events (lib/sync/derive.ts), and store the results in
 * run_lanes (result, derived flights/breakdown/versions, review flag) — and give each run a new
 * server_seq and this transaction's xid so devices pull the new results — in ONE statement for
 * up to 500 lanes. The caller holds the runs' row locks (lockRuns) and read `runs` after taking
 * them. Events go to the derivation in id order (UUIDv7: creation order, as a phone holds them),
 * so the same events give the same result however they were read. Returns the last server
 * sequence number as that statement saw it.
 */
export async function storeDerivations(tx: Tx, loaded: readonly LoadedRun[], estimates: ReadonlyMap<string, readonly ClockEstimate[]>): Promise<number> {
  if (loaded.length === 0) return currentServerSeq(tx);
  const updates = [];
  for (const run of loaded) {
    const derived = deriveRun({
      task: parseTaskDefinition(run.task),
      createdBy: run.createdBy,
      lanes: run.lanes,
      officials: NO_OFFICIALS,
      events: [...run.events].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0)),
      estimatesByDevice: estimates,
    });
    for (const d of derived) {
      updates.push(
        sql`(${run.id}::uuid, ${d.lane}::smallint, ${d.resultTenths}::integer, ${JSON.stringify(d.derived)}::jsonb, ${d.needsReview}::boolean, ${d.reviewReason}::text)`,
      );
    }
  }
  const idList = sql.join(loaded.map((r) => sql`${r.id}::uuid`), sql`, `);
  // the lanes' results, the runs' new stamp and the sequence's position in one statement
  const restamp = sql`restamp as (update runs set server_seq = nextval('sync_seq'), xid = pg_current_xact_id() where id in (${idList}) returning 1)`;
  const seq = sql`select last_value, is_called from sync_seq`;
  let last = 0;
  for (let i = 0; i === 0 || i < updates.length; i += 500) {
    const chunk = updates.slice(i, i + 500);
    const lanes = chunk.length === 0 ? sql`` : sql`, lanes as (
      update run_lanes set result_tenths = v.result, derived = v.derived, needs_review = v.review, review_reason = v.reason
      from (values ${sql.join(chunk, sql`, `)}) as v(run_id, lane, result, derived, review, reason)
      where run_lanes.run_id = v.run_id and run_lanes.lane = v.lane returning 1)`;
    const r = await tx.execute<{ last_value: string; is_called: boolean }>(i === 0 ? sql`with ${restamp}${lanes} ${seq}` : sql`with ${sql.raw("x as (select 1)")}${lanes} ${seq}`);
    const row = r.rows[0];
    last = row && row.is_called ? Number(row.last_value) : 0;
  }
  return last;
}

/** Derive every run in the database (the demo seed stores events without results). */
export async function deriveAllRuns(tx: Tx, chunk = 200): Promise<number> {
  const all = await tx.select({ id: runs.id }).from(runs).orderBy(runs.serverSeq);
  for (let i = 0; i < all.length; i += chunk) await deriveAndStoreRuns(tx, all.slice(i, i + chunk).map((r) => r.id));
  return all.length;
}
