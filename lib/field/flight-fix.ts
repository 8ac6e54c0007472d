import type { RunEvent } from "@/lib/events/schema";
import type { TimelineEvent } from "@/lib/tasks";
import { pairFlights } from "@/lib/tasks/flights";

/**
 * The `correct` event body that sets a landed flight's time to `newTenths` by moving its
 * landing (the launch stays: it is the moment the timekeeper saw the release); half a
 * millisecond past the tenth keeps truncation exact.
 * Null when the flight does not exist or has not landed.
 */
export function flightTimeCorrection(
  timeline: readonly TimelineEvent[],
  events: readonly RunEvent[],
  lane: number,
  flightIndex: number,
  laneCount: number,
  newTenths: number,
): Correction | null {
  if (!Number.isInteger(newTenths) || newTenths < 0) return null;
  const flight = pairFlights(timeline, laneCount).lanes[lane]?.flights[flightIndex];
  if (!flight || flight.landId === null) return null;
  return moveTo(timeline, events, flight.landId, flight.launchAtMs + newTenths * 100 + 0.5);
}

type Correction = { kind: "correct"; targetId: string; wallMs: number };

/**
 * The `correct` body that puts event `targetId` at `atMs` on the run's timeline, written on
 * the event's own device clock (its stamp's wall time), as the engine and the server expect.
 */
function moveTo(timeline: readonly TimelineEvent[], events: readonly RunEvent[], targetId: string, atMs: number): Correction | null {
  const target = events.find((e) => e.id === targetId);
  const placed = timeline.find((e) => e.id === targetId);
  if (!target || !placed) return null;
  return { kind: "correct", targetId, wallMs: atMs - (placed.atMs - target.stamp.wallMs) };
}

/**
 * The working-time signal a launch is measured from: the latest one at or before it, else the
 * first (as the engine's `launchMs`: task C measures from its attempt's signal).
 */
function signalFor(timeline: readonly TimelineEvent[], atMs: number): number | null {
  const starts = timeline.filter((e) => e.body.kind === "window-start").map((e) => e.atMs);
  if (starts.length === 0) return null;
  return starts.filter((t) => t <= atMs).at(-1) ?? starts[0]!;
}

/**
 * The `correct` body that moves a flight's launch to `intoWindowTenths` of working time
 * (the landing stays), or the reason it cannot: the launch must stay after the lane's previous
 * landing and before this flight's landing, or the flights would pair differently.
 */
export function launchTimeCorrection(
  timeline: readonly TimelineEvent[],
  events: readonly RunEvent[],
  lane: number,
  flightIndex: number,
  laneCount: number,
  intoWindowTenths: number,
): { body: Correction } | { error: string } {
  const flights = pairFlights(timeline, laneCount).lanes[lane]?.flights ?? [];
  const flight = flights[flightIndex];
  const signal = flight ? signalFor(timeline, flight.launchAtMs) : null;
  if (!flight || signal === null || !Number.isInteger(intoWindowTenths)) return { error: "There is no such flight to correct." };
  const atMs = signal + intoWindowTenths * 100;
  const previousLanding = flights[flightIndex - 1]?.landAtMs ?? null;
  if (previousLanding !== null && atMs <= previousLanding) return { error: "The launch must come after the previous flight's landing." };
  if (flight.landAtMs !== null && atMs >= flight.landAtMs) return { error: "The launch must come before this flight's landing." };
  const body = moveTo(timeline, events, flight.launchId, atMs);
  return body ? { body } : { error: "There is no such flight to correct." };
}

/** Parses a typed flight time ("63", "63.4", "1:03.4") into tenths; null if unreadable. */
export function parseFlightTime(text: string): number | null {
  const m = /^\s*(?:(\d{1,2}):)?(\d{1,4})(?:[.,](\d))?\s*$/.exec(text);
  if (!m) return null;
  const minutes = m[1] ? Number(m[1]) : 0;
  const seconds = Number(m[2]);
  if (m[1] && seconds >= 60) return null;
  return (minutes * 60 + seconds) * 10 + (m[3] ? Number(m[3]) : 0);
}
