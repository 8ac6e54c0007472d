import type { ClockEstimate } from "./drift";

/** Most clock estimates the server keeps per device. */
export const MAX_ESTIMATES_PER_DEVICE = 32;

/**
 * The estimates worth keeping when a device has more than `max` (any order in, oldest first
 * out). RFC 5905 §10's clock filter prefers the sample with the least delay δ, because the error
 * of θ from path asymmetry is at most δ/2 (§8); its drift bound (its frequency tolerance PHI, 15 ppm) makes an
 * estimate worse the farther in time it is used. So both count here. Interpolation only ever uses the nearest estimate before and after an event, so what
 * matters is coverage in time and a small delay: while too many are left, take the two
 * estimates closest together in time and drop the one with the larger δ (on a tie, the older).
 * A lone estimate at either side of an offline period has no close neighbour and survives;
 * a dense run of measurements while online thins out to its best ones.
 */
export function pruneEstimates(estimates: readonly ClockEstimate[], max = MAX_ESTIMATES_PER_DEVICE): ClockEstimate[] {
  const kept = [...estimates].sort((a, b) => a.measuredAtWallMs - b.measuredAtWallMs);
  while (kept.length > Math.max(max, 1)) {
    let at = 0;
    let gap = Number.POSITIVE_INFINITY;
    for (let i = 0; i + 1 < kept.length; i++) {
      const g = kept[i + 1]!.measuredAtWallMs - kept[i]!.measuredAtWallMs;
      if (g < gap) [gap, at] = [g, i];
    }
    const [a, b] = [kept[at]!, kept[at + 1]!];
    kept.splice(b.deltaMs > a.deltaMs ? at + 1 : at, 1);
  }
  return kept;
}
