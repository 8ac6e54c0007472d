import "server-only";
import { and, eq, inArray, sql, type SQL } from "drizzle-orm";
import { MAX_ESTIMATES_PER_DEVICE, pruneEstimates, storedOffset, type ClockEstimate } from "@/lib/clock";
import { affectedWallRange, correctStamp } from "@/lib/sync/correct-events";
import { deviceClockEstimates } from "../schema";
import type { Tx } from "./sync-db";

/**
 * Store a device's clock estimates (from the push and from its events' stamps) and re-correct
 * its stored events whose offset the change moves — interpolating across the offline period
 * between the estimate before and the one after (SYNC.md §4). At most MAX_ESTIMATES_PER_DEVICE
 * are kept (pruneEstimates: coverage in time first, then the smallest δ); a pruned estimate the
 * device sends again is pruned again, not stored. Returns the device's estimates and the runs
 * whose events moved (to re-derive). `stored`: the device's estimates as the caller already read them. Call after claimDevice: its row lock makes one device's pushes take turns.
 */
export async function storeClockEstimates(
  tx: Tx,
  deviceId: string,
  incoming: readonly ClockEstimate[],
  stored?: readonly ClockEstimate[],
): Promise<{ estimates: ClockEstimate[]; movedRuns: Set<string> }> {
  const existing: ClockEstimate[] = stored
    ? [...stored]
    : await tx
        .select({ thetaMs: deviceClockEstimates.thetaMs, deltaMs: deviceClockEstimates.deltaMs, measuredAtWallMs: deviceClockEstimates.measuredAtWallMs })
        .from(deviceClockEstimates)
        .where(eq(deviceClockEstimates.deviceId, deviceId));
  const plan = clockEstimateStatements(tx, deviceId, existing, incoming);
  for (const write of plan.writes) await tx.execute(write);
  if (!plan.read) return { estimates: plan.estimates, movedRuns: new Set() };
  const moved = movedStamps((await tx.execute<StampRow>(plan.read)).rows, plan.estimates);
  for (const update of moved.updates) await tx.execute(update);
  return { estimates: plan.estimates, movedRuns: moved.movedRuns };
}

/**
 * storeClockEstimates as statements, for a pipelined message: the estimates kept (`estimates`), the writes that
 * store them (insert, delete), and `read` (null when no stored stamp can move), the device's events whose corrected
 * time the change may move — its rows go to movedStamps, whose updates must follow in the same transaction.
 */
export function clockEstimateStatements(
  tx: Tx,
  deviceId: string,
  existing: readonly ClockEstimate[],
  incoming: readonly ClockEstimate[],
): { estimates: ClockEstimate[]; writes: SQL[]; read: SQL | null } {
  const fresh = freshEstimates(existing, incoming);
  if (fresh.size === 0 && existing.length <= MAX_ESTIMATES_PER_DEVICE) return { estimates: [...existing], writes: [], read: null };

  const candidates = [...existing, ...fresh.values()];
  const all = pruneEstimates(candidates);
  const keep = new Set(all.map((e) => e.measuredAtWallMs));
  const added = [...fresh.values()].filter((e) => keep.has(e.measuredAtWallMs));
  const dropped = existing.filter((e) => !keep.has(e.measuredAtWallMs));
  const writes: SQL[] = [];
  if (added.length > 0) writes.push(tx.insert(deviceClockEstimates).values(added.map((e) => ({ deviceId, ...e }))).onConflictDoNothing().getSQL());
  if (dropped.length > 0) {
    writes.push(tx
      .delete(deviceClockEstimates)
      .where(and(eq(deviceClockEstimates.deviceId, deviceId), inArray(deviceClockEstimates.measuredAtWallMs, dropped.map((e) => e.measuredAtWallMs))))
      .getSQL());
  }
  const range = affectedWallRange(candidates, [...added, ...dropped]);
  if (!range) return { estimates: all, writes, read: null };

  const [lo, hi] = range;
  const where = [sql`device_id = ${deviceId}`];
  if (Number.isFinite(lo)) where.push(sql`wall_ms > ${lo}`);
  if (Number.isFinite(hi)) where.push(sql`wall_ms < ${hi}`);
  const read = sql`select id, run_id, wall_ms, mono_ms, page_id, offset_theta_ms, offset_delta_ms, offset_measured_at_ms, corrected_ms, uncertainty_ms
    from events where ${sql.join(where, sql` and `)}`;
  return { estimates: all, writes, read };
}

/** A row of clockEstimateStatements' `read` (float8 columns come back as numbers). */
export type StampRow = {
  id: string; run_id: string; wall_ms: number; mono_ms: number; page_id: string;
  offset_theta_ms: number | null; offset_delta_ms: number | null; offset_measured_at_ms: number | null;
  corrected_ms: number; uncertainty_ms: number | null;
};

/** The events among `rows` whose corrected time the device's estimates `all` move: their updates and their runs. */
export function movedStamps(rows: readonly StampRow[], all: readonly ClockEstimate[]): { updates: SQL[]; movedRuns: Set<string> } {
  const movedRuns = new Set<string>();
  const changes = [];
  for (const row of rows) {
    const offset = storedOffset(row.offset_theta_ms, row.offset_delta_ms, row.offset_measured_at_ms);
    const c = correctStamp({ wallMs: row.wall_ms, monoMs: row.mono_ms, pageId: row.page_id, offset }, all);
    if (c.correctedMs === row.corrected_ms && c.uncertaintyMs === row.uncertainty_ms) continue;
    changes.push(sql`(${row.id}::uuid, ${c.correctedMs}::double precision, ${c.uncertaintyMs}::double precision)`);
    movedRuns.add(row.run_id);
  }
  const updates: SQL[] = [];
  for (let i = 0; i < changes.length; i += 500) {
    updates.push(sql`
      update events set corrected_ms = v.corrected, uncertainty_ms = v.uncertainty
      from (values ${sql.join(changes.slice(i, i + 500), sql`, `)}) as v(id, corrected, uncertainty)
      where events.id = v.id`);
  }
  return { updates, movedRuns };
}

/** The incoming estimates the device's stored ones do not hold yet (by measurement time), first of each time. */
function freshEstimates(existing: readonly ClockEstimate[], incoming: readonly ClockEstimate[]): Map<number, ClockEstimate> {
  const known = new Set(existing.map((e) => e.measuredAtWallMs));
  const fresh = new Map<number, ClockEstimate>();
  for (const e of incoming) if (!known.has(e.measuredAtWallMs) && !fresh.has(e.measuredAtWallMs)) fresh.set(e.measuredAtWallMs, e);
  return fresh;
}

/** Whether storeClockEstimates would write anything (and so may move stored events) for these estimates. */
export function estimatesChange(stored: readonly ClockEstimate[], incoming: readonly ClockEstimate[]): boolean {
  return freshEstimates(stored, incoming).size > 0 || stored.length > MAX_ESTIMATES_PER_DEVICE;
}
