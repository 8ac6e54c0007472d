import type { AllUpTask, PokerTask, WindowTask } from "./definition";
import type { InvalidReason, LaneLog, RawFlight } from "./flights";
import { msToTenths } from "./time";

/** Why a flight scores nothing (`invalid`) or is left out of the task (`not-counted`). */
export type FlightReason =
  | "launched-before-working-time"
  | "launched-after-working-time"
  | "landed-after-landing-window"
  | "never-landed"
  | "marked-invalid"
  | "beyond-launch-limit"
  | "superseded"
  | "not-among-best"
  | "beyond-ladder"
  | "no-target"
  | "target-missed"
  | "after-final-target"
  | "launched-before-signal"
  | "launched-late"
  | "second-launch-in-attempt"
  | "after-last-attempt";

/** A flight with the timing rules applied, before the counting rule picks what counts. */
export type TimedFlight = {
  index: number;
  launchId: string;
  launchAtMs: number;
  landAtMs: number | null;
  /** Launch relative to working-time start (task C: to its attempt's signal). */
  launchMs: number;
  landMs: number | null;
  /** Task C: the attempt (0-based) this launch belongs to. */
  attempt: number | null;
  /** Still in the air at `nowMs` (live state only). */
  open: boolean;
  /** Time by the timing rules in tenths (0 when `zeroReason` is set). */
  timeTenths: number;
  /**
   * The whole flight as timed, launch to landing (in the air: to now), in tenths; null when it
   * never landed. The one flight time every screen shows: nothing recomputes it from launchMs/landMs.
   */
  airTenths: number | null;
  /** Airtime inside the working time in tenths, valid or not (for the points-lost breakdown). */
  inWindowTenths: number;
  /** The flight scores zero by rule. */
  zeroReason: FlightReason | null;
  /** The flight is outside the task (after working time, beyond the launch limit). */
  excludedReason: FlightReason | null;
  markedInvalid: InvalidReason | null;
};

/** `nowMs` set: live — an open flight is timed to now. null: finished — an open flight never landed. */
export type Clock = { nowMs: number } | null;

/**
 * Applies F3K.6/F3K.7 timing to one lane of a working-time task.
 *
 * Choices on points the rules leave open (documented in the README):
 * - A launch before working time scores zero and still uses one of a limited task's launches.
 * - A launch at or after the end of working time is outside the task: it scores nothing and
 *   does not displace a "last flight" (A, B, J).
 * - A landing exactly at the end of the landing window is in time (inclusive boundary).
 * - Without a window-start event every launch is before working time; times are then shown
 *   relative to the lane's first launch.
 */
export function timeWindowFlights(def: WindowTask | PokerTask, startMs: number | null, log: LaneLog, clock: Clock): TimedFlight[] {
  const wtMs = def.workingTimeSec * 1000;
  const base = startMs ?? log.flights[0]?.launchAtMs ?? 0;
  const endAtMs = startMs === null ? -Infinity : startMs + wtMs;
  const landingDeadline = endAtMs + def.landingWindowSec * 1000;
  const limit = def.kind === "window" ? def.launchLimit : null;
  let launches = 0;
  return log.flights.map((f) => {
    const t = blank(f, base, log, clock);
    if (startMs !== null && f.launchAtMs >= endAtMs) return { ...t, excludedReason: "launched-after-working-time" };
    const landAt = t.open ? clock!.nowMs : f.landAtMs;
    if (startMs !== null && landAt !== null) {
      t.inWindowTenths = msToTenths(Math.min(landAt, endAtMs) - Math.max(f.launchAtMs, startMs));
    }
    launches += 1;
    if (limit !== null && launches > limit) return { ...t, excludedReason: "beyond-launch-limit" };
    let zero: FlightReason | null = null;
    if (t.markedInvalid) zero = "marked-invalid";
    else if (startMs === null || f.launchAtMs < startMs) zero = "launched-before-working-time";
    else if (landAt === null) zero = "never-landed";
    else if (landAt > landingDeadline) zero = "landed-after-landing-window";
    if (zero) return { ...t, zeroReason: zero };
    return { ...t, timeTenths: msToTenths(Math.min(landAt!, endAtMs) - f.launchAtMs) };
  });
}

/**
 * Applies task C timing: one launch per attempt, within `launchWindowMs` of that attempt's
 * signal, landing by `landingDeadlineSec` after it.
 *
 * A launch belongs to attempt k when it comes after attempt k−1's landing deadline (so an
 * early launch during the preparation before signal k is attempt k's, and scores zero) and
 * no later than attempt k's deadline; only the first such launch is the attempt.
 */
export function timeAllUpFlights(def: AllUpTask, signalsMs: readonly number[], log: LaneLog, clock: Clock): TimedFlight[] {
  const signals = signalsMs.slice(0, def.attempts);
  const deadlineMs = def.landingDeadlineSec * 1000;
  const taken = new Set<number>();
  return log.flights.map((f) => {
    let attempt = 0;
    while (attempt < signals.length && f.launchAtMs > signals[attempt]! + deadlineMs) attempt++;
    const signal = signals[attempt];
    const base = signal ?? f.launchAtMs;
    const t: TimedFlight = { ...blank(f, base, log, clock), attempt };
    if (attempt >= def.attempts) return { ...t, attempt: null, excludedReason: "after-last-attempt" };
    if (taken.has(attempt)) return { ...t, excludedReason: "second-launch-in-attempt" };
    taken.add(attempt);
    const landAt = t.open ? clock!.nowMs : f.landAtMs;
    if (landAt !== null) t.inWindowTenths = msToTenths(landAt - f.launchAtMs);
    let zero: FlightReason | null = null;
    if (t.markedInvalid) zero = "marked-invalid";
    else if (signal === undefined || f.launchAtMs < signal) zero = "launched-before-signal";
    else if (f.launchAtMs - signal > def.launchWindowMs) zero = "launched-late";
    else if (landAt === null) zero = "never-landed";
    else if (landAt - signal > deadlineMs) zero = "landed-after-landing-window";
    if (zero) return { ...t, zeroReason: zero };
    return { ...t, timeTenths: msToTenths(landAt! - f.launchAtMs) };
  });
}

function blank(f: RawFlight, base: number, log: LaneLog, clock: Clock): TimedFlight {
  const open = f.landAtMs === null && clock !== null;
  return {
    index: f.index,
    launchId: f.launchId,
    launchAtMs: f.launchAtMs,
    landAtMs: f.landAtMs,
    launchMs: f.launchAtMs - base,
    landMs: f.landAtMs === null ? null : f.landAtMs - base,
    attempt: null,
    open,
    airTenths: open ? msToTenths(clock!.nowMs - f.launchAtMs) : f.landAtMs === null ? null : msToTenths(f.landAtMs - f.launchAtMs),
    timeTenths: 0,
    inWindowTenths: 0,
    zeroReason: null,
    excludedReason: null,
    markedInvalid: log.invalid.get(f.launchId) ?? null,
  };
}
