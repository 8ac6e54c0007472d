import "server-only";
import { inArray, sql } from "drizzle-orm";
import type { ClockEstimate } from "@/lib/clock";
import type { EventBody } from "@/lib/events/schema";
import { deriveRun, type DerivationEvent } from "@/lib/sync/derive";
import { uncertaintyOf } from "@/lib/sync/correct-events";
import { parseTaskDefinition } from "@/lib/tasks";
import { deviceClockEstimates, events, runs } from "../schema";
import { lockRuns, type Tx } from "./sync-db";

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
 * Re-derive the results of these runs from their stored events (lib/sync/derive.ts)
 * and store them in run_lanes (result, derived flights/breakdown/versions, review flag), once per
 * run however many of its events the caller stored. Each run gets a new server_seq and this
 * transaction's xid so devices pull the new results. Locks the runs' rows (lockRuns) first, so
 * a concurrent writer of the same run waits and then derives from everything committed —
 * nothing else is locked.
 */
export async function deriveAndStoreRuns(tx: Tx, runIds: Iterable<string>): Promise<void> {
  const ids = [...new Set(runIds)];
  if (ids.length === 0) return;
  await lockRuns(tx, ids);
  // one connection: queries in a transaction run one after another, so few of them
  const idList = sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `);
  const runRows = await tx.execute<{ id: string; task: unknown; created_by: string; lanes: { lane: number; pilotUserId: string | null }[] | null }>(sql`
    select r.id, r.task, r.created_by,
      (select json_agg(json_build_object('lane', l.lane, 'pilotUserId', l.pilot_user_id) order by l.lane) from run_lanes l where l.run_id = r.id) as lanes
    from runs r where r.id in (${idList})`);
  const eventRows = await tx.select().from(events).where(inArray(events.runId, ids));
  const estimates = await listDeviceEstimates(tx, [...new Set(eventRows.map((e) => e.deviceId))]);
  const byRun = new Map<string, EventRow[]>();
  for (const e of eventRows) byRun.set(e.runId, [...(byRun.get(e.runId) ?? []), e]);
  const updates = [];
  for (const run of runRows.rows) {
    const derived = deriveRun({
      task: parseTaskDefinition(run.task),
      createdBy: run.created_by,
      lanes: run.lanes ?? [],
      officials: NO_OFFICIALS,
      events: (byRun.get(run.id) ?? []).map(toDerivationEvent),
      estimatesByDevice: estimates,
    });
    for (const d of derived) {
      updates.push(
        sql`(${run.id}::uuid, ${d.lane}::smallint, ${d.resultTenths}::integer, ${JSON.stringify(d.derived)}::jsonb, ${d.needsReview}::boolean, ${d.reviewReason}::text)`,
      );
    }
  }
  // the lanes' results and the runs' new stamp in one statement
  const restamp = sql`restamp as (update runs set server_seq = nextval('sync_seq'), xid = pg_current_xact_id() where id in (${idList}) returning 1)`;
  if (updates.length === 0) await tx.execute(sql`with ${restamp} select count(*) from restamp`);
  for (let i = 0; i < updates.length; i += 500) {
    await tx.execute(sql`${i === 0 ? sql`with ${restamp}` : sql``}
      update run_lanes set result_tenths = v.result, derived = v.derived, needs_review = v.review, review_reason = v.reason
      from (values ${sql.join(updates.slice(i, i + 500), sql`, `)}) as v(run_id, lane, result, derived, review, reason)
      where run_lanes.run_id = v.run_id and run_lanes.lane = v.lane`);
  }
}

/** Derive every run in the database (the demo seed stores events without results). */
export async function deriveAllRuns(tx: Tx, chunk = 200): Promise<number> {
  const all = await tx.select({ id: runs.id }).from(runs).orderBy(runs.serverSeq);
  for (let i = 0; i < all.length; i += chunk) await deriveAndStoreRuns(tx, all.slice(i, i + chunk).map((r) => r.id));
  return all.length;
}
