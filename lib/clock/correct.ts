import type { ClockEstimate } from "./drift";
import { offsetAt } from "./interpolate";

/** What a device records with every event (the shape of `stampSchema` in lib/events/schema.ts). */
export type DeviceStamp = {
  wallMs: number;
  monoMs: number;
  pageId: string;
  offset: ClockEstimate | null;
};

/** A device time put on the server's timeline. */
export type CorrectedTime = { serverMs: number; uncertaintyMs: number };

/**
 * Monotonic and wall durations inside one page lifetime may differ by this much before
 * we conclude the device slept (the monotonic clock stops) or its wall clock was stepped.
 * Our choice: OS slewing stays far below it, a sleep or a step is usually far above.
 */
export const SLEEP_TOLERANCE_MS = 1000;

function sameEstimate(a: ClockEstimate, b: ClockEstimate): boolean {
  return a.measuredAtWallMs === b.measuredAtWallMs && a.thetaMs === b.thetaMs && a.deltaMs === b.deltaMs;
}

/**
 * Server time of a device stamp: wall time + the offset at that moment, taken from the
 * device's estimates (interpolated across an offline period, held with a growing bound
 * outside them) together with the estimate the stamp itself carries. With no estimate
 * at all the uncertainty is unbounded (`Infinity`) and the wall time is returned as is.
 */
export function correctTime(stamp: DeviceStamp, estimates: readonly ClockEstimate[] = []): CorrectedTime {
  const all = stamp.offset && !estimates.some((e) => sameEstimate(e, stamp.offset!))
    ? [...estimates, stamp.offset]
    : estimates;
  const at = offsetAt(all, stamp.wallMs);
  if (at === null) return { serverMs: stamp.wallMs, uncertaintyMs: Number.POSITIVE_INFINITY };
  return { serverMs: stamp.wallMs + at.thetaMs, uncertaintyMs: at.uncertaintyMs };
}

/** How a duration between two stamps was measured. */
export type Elapsed = { ms: number; uncertaintyMs: number; source: "monotonic" | "corrected-wall" };

/**
 * Time from stamp `from` to stamp `to` (SYNC.md §4): inside one page lifetime the
 * monotonic clock, exact and immune to wall-clock steps — unless wall and monotonic
 * disagree by more than SLEEP_TOLERANCE_MS (the device slept and the monotonic clock
 * stopped). Across pages, sleeps or devices: the difference of the corrected wall
 * times, uncertainties added (a conservative sum; both may share one offset).
 */
export function elapsedBetween(
  from: DeviceStamp,
  to: DeviceStamp,
  estimatesFrom: readonly ClockEstimate[] = [],
  estimatesTo: readonly ClockEstimate[] = estimatesFrom,
): Elapsed {
  if (from.pageId === to.pageId) {
    const mono = to.monoMs - from.monoMs;
    const wall = to.wallMs - from.wallMs;
    if (Math.abs(wall - mono) <= SLEEP_TOLERANCE_MS) return { ms: mono, uncertaintyMs: 0, source: "monotonic" };
  }
  const a = correctTime(from, estimatesFrom);
  const b = correctTime(to, estimatesTo);
  return { ms: b.serverMs - a.serverMs, uncertaintyMs: a.uncertaintyMs + b.uncertaintyMs, source: "corrected-wall" };
}

/** Where an event lies relative to a boundary such as the working-time signal. */
export type BoundaryVerdict = "before" | "after" | "uncertain";

/**
 * Whether an event is surely before or surely after a boundary, both on the server
 * timeline with their uncertainties. "uncertain" when the two intervals touch or overlap
 * (an exact tie included): officials review it instead of the code guessing (SYNC.md §4).
 * Throws on NaN; an infinite uncertainty is always "uncertain".
 */
export function judgeBoundary(
  eventMs: number,
  eventUncertaintyMs: number,
  boundaryMs: number,
  boundaryUncertaintyMs: number,
): BoundaryVerdict {
  for (const v of [eventMs, eventUncertaintyMs, boundaryMs, boundaryUncertaintyMs]) {
    if (Number.isNaN(v)) throw new RangeError("judgeBoundary: NaN input");
  }
  if (eventUncertaintyMs < 0 || boundaryUncertaintyMs < 0) {
    throw new RangeError("judgeBoundary: uncertainties must be ≥ 0");
  }
  const margin = eventUncertaintyMs + boundaryUncertaintyMs;
  if (eventMs + margin < boundaryMs) return "before";
  if (eventMs - margin > boundaryMs) return "after";
  return "uncertain";
}
