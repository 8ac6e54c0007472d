// Lift timeline: when the air was good over a field day. From every pilot's
// corrected flights, a heat strip by quarter hour in which each flight counts by
// how far it beat that pilot's own median flight time (flights at or under the
// median count nothing), so one strong pilot does not paint the whole day.
// Pure: no framework, no clock, no I/O.
import { median } from "@/lib/hangar/stats";

export const QUARTER_HOUR_MS = 15 * 60_000;

export type DayFlight = {
  pilotId: string;
  /** Launch time on the corrected (server) clock, epoch milliseconds. */
  launchedAtMs: number;
  /** Flight time in milliseconds. */
  durationMs: number;
};

export type LiftBin = {
  /** Start of the quarter hour, epoch milliseconds. */
  startMs: number;
  /** Flights launched in this quarter hour. */
  flights: number;
  /** Sum over those flights of (flight time − pilot's median) / pilot's median, above-median only. */
  lift: number;
  /** lift divided by the strongest bin's lift: 0 (still air) … 1 (best quarter hour). */
  intensity: number;
};

/** How far one flight beat its pilot's median, as a fraction of that median (never negative). */
export function flightLift(durationMs: number, pilotMedianMs: number): number {
  if (pilotMedianMs <= 0 || durationMs <= pilotMedianMs) return 0;
  return (durationMs - pilotMedianMs) / pilotMedianMs;
}

function quarterStart(ms: number): number {
  return Math.floor(ms / QUARTER_HOUR_MS) * QUARTER_HOUR_MS;
}

export function buildLiftTimeline(flights: readonly DayFlight[]): LiftBin[] {
  const usable = flights.filter(
    (f) => Number.isFinite(f.launchedAtMs) && Number.isFinite(f.durationMs) && f.durationMs > 0,
  );
  if (usable.length === 0) return [];

  const byPilot = new Map<string, number[]>();
  for (const f of usable) {
    const list = byPilot.get(f.pilotId) ?? [];
    list.push(f.durationMs);
    byPilot.set(f.pilotId, list);
  }
  const medians = new Map([...byPilot].map(([pilot, times]) => [pilot, median(times) ?? 0]));

  const first = Math.min(...usable.map((f) => quarterStart(f.launchedAtMs)));
  const last = Math.max(...usable.map((f) => quarterStart(f.launchedAtMs)));
  const bins: LiftBin[] = [];
  for (let start = first; start <= last; start += QUARTER_HOUR_MS) {
    bins.push({ startMs: start, flights: 0, lift: 0, intensity: 0 });
  }
  for (const f of usable) {
    const bin = bins[(quarterStart(f.launchedAtMs) - first) / QUARTER_HOUR_MS]!;
    bin.flights += 1;
    bin.lift += flightLift(f.durationMs, medians.get(f.pilotId) ?? 0);
  }
  const strongest = Math.max(...bins.map((b) => b.lift));
  for (const bin of bins) bin.intensity = strongest > 0 ? bin.lift / strongest : 0;
  return bins;
}

/** The strongest quarter hour, or null on a day with no above-median flight. */
export function bestQuarter(bins: readonly LiftBin[]): LiftBin | null {
  let best: LiftBin | null = null;
  for (const bin of bins) if (bin.lift > 0 && (best === null || bin.lift > best.lift)) best = bin;
  return best;
}
