import { correctTime, type ClockEstimate } from "@/lib/clock";
import type { Stamp } from "@/lib/events/schema";

/**
 * Corrected times as the server stores them (SYNC.md §4): the raw stamp stays as recorded;
 * the corrected time is recomputed whenever the device's estimates change.
 */

/** Server time and bound of a stamp given every estimate known for its device; unbounded → null. */
export function correctStamp(stamp: Stamp, estimates: readonly ClockEstimate[]): { correctedMs: number; uncertaintyMs: number | null } {
  const c = correctTime(stamp, estimates);
  return { correctedMs: c.serverMs, uncertaintyMs: Number.isFinite(c.uncertaintyMs) ? c.uncertaintyMs : null };
}

/** Stored uncertainty (null = unbounded) back to a number. */
export function uncertaintyOf(stored: number | null): number {
  return stored === null ? Number.POSITIVE_INFINITY : stored;
}

/**
 * Device wall-time interval whose corrected times may change when `added` join the device's
 * estimates (`all` = the full set after adding). offsetAt uses the nearest estimate at or
 * before and at or after a moment, so only moments between a new estimate's neighbours in
 * the full set are affected. Returns null when nothing was added.
 */
export function affectedWallRange(all: readonly ClockEstimate[], added: readonly ClockEstimate[]): [number, number] | null {
  if (added.length === 0) return null;
  const times = [...new Set(all.map((e) => e.measuredAtWallMs))].sort((a, b) => a - b);
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const e of added) {
    const i = times.indexOf(e.measuredAtWallMs);
    lo = Math.min(lo, i > 0 ? times[i - 1]! : Number.NEGATIVE_INFINITY);
    hi = Math.max(hi, i >= 0 && i < times.length - 1 ? times[i + 1]! : Number.POSITIVE_INFINITY);
  }
  return [lo, hi];
}
