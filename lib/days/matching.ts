// Which runs belong to a club's field day. A run belongs when the pilot chose the day for it, or
// when it was recorded at one of the day's fields and its corrected start falls on the day on the
// club's clock (its time zone, ./time-zone.ts). "At the field": where the field and the session both
// carry a position, within FIELD_RADIUS_M of it, whatever the names (the place wins over the name);
// else the session names the field. The start is read on the
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


/** A position in decimal degrees (WGS 84), as the phone's location and the club's field store it. */
export type Position = { latitude: number; longitude: number };

/**
 * How near a session must be to a field's position to count as at that field: 1 km (our choice: a
 * flying field and its car park fit well within it, and two fields a club flies are rarely closer).
 */
export const FIELD_RADIUS_M = 1000;

const EARTH_RADIUS_M = 6_371_008.8; // the mean Earth radius (IUGG), enough for a 1 km test

/** The great-circle distance between two positions in metres (haversine formula on a sphere). */
export function distanceM(a: Position, b: Position): number {
  const rad = Math.PI / 180;
  const dLat = (b.latitude - a.latitude) * rad;
  const dLon = (b.longitude - a.longitude) * rad;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.latitude * rad) * Math.cos(b.latitude * rad) * Math.sin(dLon / 2) ** 2;
  return 2 * EARTH_RADIUS_M * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** A field of the day: its name, and its position when the club gave one. */
export type DayField = { name: string; position?: Position | null };

const positioned = (p: Position | null | undefined): p is Position =>
  p != null && Number.isFinite(p.latitude) && Number.isFinite(p.longitude);

/**
 * The day's field a session was at, or null: by position when both the field and the session have one
 * (within FIELD_RADIUS_M, the nearest first), else by name (fieldKey). A field with a position never
 * takes a positioned session by its name alone: the same name at another place is another field.
 */
export function fieldOfSession(session: { fieldName: string; position?: Position | null }, fields: readonly DayField[]): DayField | null {
  const here = session.position;
  let best: { field: DayField; m: number } | null = null;
  for (const f of fields) {
    if (positioned(here) && positioned(f.position)) {
      const m = distanceM(here, f.position);
      if (m <= FIELD_RADIUS_M && (best === null || m < best.m)) best = { field: f, m };
    }
  }
  if (best) return best.field;
  const key = fieldKey(session.fieldName);
  return fields.find((f) => !(positioned(here) && positioned(f.position)) && fieldKey(f.name) === key) ?? null;
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
  /** Where the session was (the phone's position), when it knows. */
  sessionPosition?: Position | null;
  createdAtMs: number;
  laneDerived: readonly unknown[];
  /** The pilot chose this day for the run (from the run page): it belongs whatever its field and time. */
  chosen: boolean;
};

/**
 * The runs of `candidates` that belong to the day (a date on the club's clock), each with its start and
 * the day's field it was at (null: a run chosen for the day that was at none of them). `fields`: the
 * day's fields, by name or with their positions.
 */
export function matchDayRuns<R extends CandidateRun>(
  candidates: readonly R[],
  day: string,
  fields: readonly (string | DayField)[],
  timeZone = "UTC",
): (R & { startMs: number; field: string | null })[] {
  const { startMs, endMs } = dayBounds(day, timeZone);
  const dayFields = fields.map((f) => (typeof f === "string" ? { name: f } : f));
  const out: (R & { startMs: number; field: string | null })[] = [];
  for (const c of candidates) {
    const start = runStartMs(c.laneDerived, c.createdAtMs);
    const field = fieldOfSession({ fieldName: c.sessionField, position: c.sessionPosition }, dayFields)?.name ?? null;
    if (c.chosen || (field !== null && start >= startMs && start < endMs)) out.push({ ...c, startMs: start, field });
  }
  return out.sort((a, b) => a.startMs - b.startMs || (a.runId < b.runId ? -1 : 1));
}
