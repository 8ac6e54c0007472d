/**
 * Drift of a device clock after an offset was measured.
 *
 * RFC 5905 takes 15 ppm as the frequency tolerance of a clock (PHI); over a day that is
 * 15e-6 × 86 400 s = 1.296 s, the "about 1.3 s per day" quoted in SYNC.md §4.
 */

/** Frequency tolerance assumed for device clocks, as a ratio (15 ppm). */
export const DRIFT_RATE = 15e-6;

/** The device's offset estimate at one moment; matches `stampSchema.offset` in lib/events/schema.ts. */
export type ClockEstimate = {
  /** θ = server time − device wall time, ms. */
  thetaMs: number;
  /** δ, the round trip of the chosen exchange, ms (≥ 0). */
  deltaMs: number;
  /** Device wall time (ms since epoch) at which it was measured. */
  measuredAtWallMs: number;
};

/** An event's stored offset columns (theta, delta, measured at) as its stamp's offset: null unless all three are set. */
export function storedOffset(thetaMs: number | null | undefined, deltaMs: number | null | undefined, measuredAtWallMs: number | null | undefined): ClockEstimate | null {
  return thetaMs != null && deltaMs != null && measuredAtWallMs != null ? { thetaMs, deltaMs, measuredAtWallMs } : null;
}

/** How much the offset may have drifted `ageMs` after (or before) a measurement. */
export function driftMs(ageMs: number): number {
  return DRIFT_RATE * Math.abs(ageMs);
}

/** Uncertainty of `estimate` used at device wall time `wallMs`: δ/2 + 15 ppm × age. */
export function boundAt(estimate: ClockEstimate, wallMs: number): number {
  return estimate.deltaMs / 2 + driftMs(wallMs - estimate.measuredAtWallMs);
}
