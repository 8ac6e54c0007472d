// Which runs belong to a club's field day. A run belongs when the pilot chose the day for it, or
// when it was recorded at one of the day's fields (its session names the field) and its corrected
// start falls on the day on the club's clock (its time zone, ./time-zone.ts). The start is read on the
// corrected clock (the working-time signal, else the first launch), so a phone whose clock is
// wrong does not move its run to another day; a run nothing was recorded in yet falls back to the
// time the phone set it up. Pure: no framework, no I/O.
import { flightInstants } from "@/lib/results/flight-instants";
import { dayBounds } from "./time-zone";

export { dayBounds };

export const DAY_MS = 24 * 3600_000;

/** Normalises a field name for comparison: trimmed, inner spaces collapsed, lower case. */
export function fieldKey(name: string): string {
  return name.trim().replace(/\s+/g, " ").toLowerCase();
}


type StoredDerived = { signal?: { atMs?: unknown } | null } | null | undefined;

/**
 * A run's start on the corrected clock: the earliest working-time signal any of its lanes carries,
 * else the earliest launch, else `createdAtMs` (the phone's own clock when it set the window up).
 */
export function runStartMs(laneDerived: readonly unknown[], createdAtMs: number): number {
  let best = Number.POSITIVE_INFINITY;
  for (const derived of laneDerived) {
    const signal = (derived as StoredDerived)?.signal?.atMs;
    if (Array.isArray(signal)) for (const at of signal) if (typeof at === "number" && Number.isFinite(at)) best = Math.min(best, at);
  }
  if (best === Number.POSITIVE_INFINITY) {
    for (const derived of laneDerived) for (const f of flightInstants(derived)) best = Math.min(best, f.launchAtMs);
  }
  return best === Number.POSITIVE_INFINITY ? createdAtMs : best;
}

export type CandidateRun = {
  runId: string;
  /** The field its session names. */
  sessionField: string;
  createdAtMs: number;
  laneDerived: readonly unknown[];
  /** The pilot chose this day for the run (from the run page): it belongs whatever its field and time. */
  chosen: boolean;
};

/** The runs of `candidates` that belong to the day (a date on the club's clock), each with its start; the day's fields by name. */
export function matchDayRuns<R extends CandidateRun>(
  candidates: readonly R[],
  day: string,
  fieldNames: readonly string[],
  timeZone = "UTC",
): (R & { startMs: number })[] {
  const { startMs, endMs } = dayBounds(day, timeZone);
  const fields = new Set(fieldNames.map(fieldKey));
  const out: (R & { startMs: number })[] = [];
  for (const c of candidates) {
    const start = runStartMs(c.laneDerived, c.createdAtMs);
    if (c.chosen || (fields.has(fieldKey(c.sessionField)) && start >= startMs && start < endMs)) out.push({ ...c, startMs: start });
  }
  return out.sort((a, b) => a.startMs - b.startMs || (a.runId < b.runId ? -1 : 1));
}
