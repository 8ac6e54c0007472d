import { boundAt, type ClockEstimate } from "./drift";

/** An offset to apply at one moment, with how far the true offset may be from it. */
export type OffsetAt = { thetaMs: number; uncertaintyMs: number };

/** The interval the true offset lies in at `wallMs`, as far as one estimate can say. */
function intervalAt(e: ClockEstimate, wallMs: number): [number, number] {
  const b = boundAt(e, wallMs);
  return [e.thetaMs - b, e.thetaMs + b];
}

/** Hold one estimate at `wallMs`, its bound growing with the distance in time. */
export function holdOffset(estimate: ClockEstimate, wallMs: number): OffsetAt {
  return { thetaMs: estimate.thetaMs, uncertaintyMs: boundAt(estimate, wallMs) };
}

/**
 * Offset at device wall time `wallMs` from the measurements before and after an offline
 * period (SYNC.md §4). Between them θ is linear in device wall time; outside them the
 * nearest estimate is held and its bound grows at 15 ppm.
 *
 * The bound between them: each estimate confines the true offset to θᵢ ± (δᵢ/2 + 15 ppm ×
 * age), so it lies in the intersection of the two intervals and the bound is the farthest
 * edge of that intersection from the interpolated θ. If the intervals do not meet, the
 * clock was stepped (or drifted faster than 15 ppm) at an unknown moment; the bound then
 * covers both intervals rather than pretending to know which one holds.
 */
export function interpolateOffset(before: ClockEstimate, after: ClockEstimate, wallMs: number): OffsetAt {
  if (after.measuredAtWallMs < before.measuredAtWallMs) return interpolateOffset(after, before, wallMs);
  if (wallMs <= before.measuredAtWallMs) return holdOffset(before, wallMs);
  if (wallMs >= after.measuredAtWallMs) return holdOffset(after, wallMs);

  const span = after.measuredAtWallMs - before.measuredAtWallMs;
  const f = (wallMs - before.measuredAtWallMs) / span;
  const thetaMs = before.thetaMs + f * (after.thetaMs - before.thetaMs);

  const [lo1, hi1] = intervalAt(before, wallMs);
  const [lo2, hi2] = intervalAt(after, wallMs);
  const meet = Math.max(lo1, lo2) <= Math.min(hi1, hi2);
  const lo = meet ? Math.max(lo1, lo2) : Math.min(lo1, lo2);
  const hi = meet ? Math.min(hi1, hi2) : Math.max(hi1, hi2);
  return { thetaMs, uncertaintyMs: Math.max(thetaMs - lo, hi - thetaMs) };
}

/**
 * The offset to use at `wallMs` given every estimate known for a device (any order):
 * interpolate between the nearest one at or before and the nearest one at or after;
 * hold the nearest when there is only one side. Null when there is no estimate at all.
 * So an event (and with it the run it belongs to) is corrected by the estimates measured
 * closest in time to it — never by a lower-δ one measured far away, whose bound (δ/2 + 15 ppm ×
 * age, RFC 5905 §8 and its 15 ppm PHI) has grown past what a near one says.
 */
export function offsetAt(estimates: readonly ClockEstimate[], wallMs: number): OffsetAt | null {
  let before: ClockEstimate | undefined;
  let after: ClockEstimate | undefined;
  for (const e of estimates) {
    if (e.measuredAtWallMs <= wallMs && (!before || e.measuredAtWallMs > before.measuredAtWallMs)) before = e;
    if (e.measuredAtWallMs >= wallMs && (!after || e.measuredAtWallMs < after.measuredAtWallMs)) after = e;
  }
  if (before && after) return interpolateOffset(before, after, wallMs);
  const only = before ?? after;
  return only ? holdOffset(only, wallMs) : null;
}
