import { msToTenths, secondsText, type LaneScore } from "@/lib/tasks";
import type { ClockStep } from "./place";
import type { ClockFlag, DerivationEvent } from "./types";

/**
 * The wall-clock steps inside a lane's chosen record: a step between a flight's launch and its
 * landing names the flight and its time by each clock (the steady one counts); any other step
 * in the record (on the ground, before the start) is listed without a flight.
 */
export function clockFlags(steps: readonly ClockStep[], events: readonly DerivationEvent[], lane: LaneScore): ClockFlag[] {
  const ids = new Set(events.map((e) => e.id));
  const byId = new Map(events.map((e) => [e.id, e]));
  const out: ClockFlag[] = [];
  const flagged = new Set<number>();
  for (const s of steps) {
    if (!ids.has(s.toEventId) || !ids.has(s.fromEventId)) continue;
    const at = byId.get(s.toEventId)!.correctedMs;
    const flight = lane.flights.find((f) => f.landAtMs !== null && f.launchAtMs < at && at <= f.landAtMs);
    if (flight) {
      if (flagged.has(flight.index)) continue;
      flagged.add(flight.index);
      const launch = byId.get(flight.launchId);
      const landing = events.find((e) => e.body.kind === "landing" && e.correctedMs === flight.landAtMs && e.deviceId === launch?.deviceId);
      if (launch && landing && launch.stamp.pageId === landing.stamp.pageId) {
        out.push({
          deviceId: s.deviceId,
          flightIndex: flight.index,
          monoTenths: msToTenths(landing.stamp.monoMs - launch.stamp.monoMs),
          wallTenths: Math.sign(landing.stamp.wallMs - launch.stamp.wallMs) * msToTenths(Math.abs(landing.stamp.wallMs - launch.stamp.wallMs)),
        });
        continue;
      }
    }
    out.push({ deviceId: s.deviceId, flightIndex: null, monoTenths: msToTenths(s.monoMs), wallTenths: Math.sign(s.wallMs) * msToTenths(Math.abs(s.wallMs)) });
  }
  return out;
}

/** One line for the pilot or an official: what each clock says, which one the result uses. */
export function describeClockFlags(flags: readonly ClockFlag[]): string | null {
  if (flags.length === 0) return null;
  const parts = flags.slice(0, 3).map((f) => {
    const what = f.flightIndex === null ? "Between two taps" : `Flight ${f.flightIndex + 1}`;
    return `${what}: ${secondsText(f.monoTenths)} s by the phone's steady clock, ${secondsText(f.wallTenths)} s by its wall clock`;
  });
  const more = flags.length > 3 ? ` (+${flags.length - 3} more)` : "";
  return `The phone's wall clock jumped during the run. ${parts.join("; ")}${more}. The steady clock's time is used; the pilot or an official decides.`;
}
