import type { RunEvent } from "@/lib/events/schema";
import type { TimelineEvent } from "@/lib/tasks";
import { pairFlights } from "@/lib/tasks/flights";

/**
 * The `correct` event body that sets a landed flight's time to `newTenths` by moving its
 * landing (the launch stays: it is the moment the timekeeper saw the release). The new
 * time is stored on the landing's own device clock (its stamp's wall time), as the engine
 * and the server expect; half a millisecond past the tenth keeps truncation exact.
 * Null when the flight does not exist or has not landed.
 */
export function flightTimeCorrection(
  timeline: readonly TimelineEvent[],
  events: readonly RunEvent[],
  lane: number,
  flightIndex: number,
  laneCount: number,
  newTenths: number,
): { kind: "correct"; targetId: string; wallMs: number } | null {
  if (!Number.isInteger(newTenths) || newTenths < 0) return null;
  const flight = pairFlights(timeline, laneCount).lanes[lane]?.flights[flightIndex];
  if (!flight || flight.landId === null) return null;
  const landing = events.find((e) => e.id === flight.landId);
  const placed = timeline.find((e) => e.id === flight.landId);
  if (!landing || !placed) return null;
  const shift = placed.atMs - landing.stamp.wallMs;
  return { kind: "correct", targetId: landing.id, wallMs: flight.launchAtMs + newTenths * 100 + 0.5 - shift };
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
