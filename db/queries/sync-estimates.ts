import "server-only";
import { and, eq, gt, inArray, lt, sql } from "drizzle-orm";
import { MAX_ESTIMATES_PER_DEVICE, pruneEstimates, type ClockEstimate } from "@/lib/clock";
import { affectedWallRange, correctStamp } from "@/lib/sync/correct-events";
import { deviceClockEstimates, events } from "../schema";
import { toDerivationEvent } from "./runs";
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
  const movedRuns = new Set<string>();
  const existing: ClockEstimate[] = stored
    ? [...stored]
    : await tx
        .select({ thetaMs: deviceClockEstimates.thetaMs, deltaMs: deviceClockEstimates.deltaMs, measuredAtWallMs: deviceClockEstimates.measuredAtWallMs })
        .from(deviceClockEstimates)
        .where(eq(deviceClockEstimates.deviceId, deviceId));
  const fresh = freshEstimates(existing, incoming);
  if (fresh.size === 0 && existing.length <= MAX_ESTIMATES_PER_DEVICE) return { estimates: existing, movedRuns };

  const candidates = [...existing, ...fresh.values()];
  const all = pruneEstimates(candidates);
  const keep = new Set(all.map((e) => e.measuredAtWallMs));
  const added = [...fresh.values()].filter((e) => keep.has(e.measuredAtWallMs));
  const dropped = existing.filter((e) => !keep.has(e.measuredAtWallMs));
  if (added.length > 0) await tx.insert(deviceClockEstimates).values(added.map((e) => ({ deviceId, ...e }))).onConflictDoNothing();
  if (dropped.length > 0) {
    await tx
      .delete(deviceClockEstimates)
      .where(and(eq(deviceClockEstimates.deviceId, deviceId), inArray(deviceClockEstimates.measuredAtWallMs, dropped.map((e) => e.measuredAtWallMs))));
  }
  const range = affectedWallRange(candidates, [...added, ...dropped]);
  if (!range) return { estimates: all, movedRuns };

  const [lo, hi] = range;
  const where = [eq(events.deviceId, deviceId)];
  if (Number.isFinite(lo)) where.push(gt(events.wallMs, lo));
  if (Number.isFinite(hi)) where.push(lt(events.wallMs, hi));
  const rows = await tx.select().from(events).where(and(...where));
  const changes = [];
  for (const row of rows) {
    const c = correctStamp(toDerivationEvent(row).stamp, all);
    if (c.correctedMs === row.correctedMs && c.uncertaintyMs === row.uncertaintyMs) continue;
    changes.push(sql`(${row.id}::uuid, ${c.correctedMs}::double precision, ${c.uncertaintyMs}::double precision)`);
    movedRuns.add(row.runId);
  }
  for (let i = 0; i < changes.length; i += 500) {
    await tx.execute(sql`
      update events set corrected_ms = v.corrected, uncertainty_ms = v.uncertainty
      from (values ${sql.join(changes.slice(i, i + 500), sql`, `)}) as v(id, corrected, uncertainty)
      where events.id = v.id`);
  }
  return { estimates: all, movedRuns };
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
