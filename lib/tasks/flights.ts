import type { InvalidReason, ReflightCause, ReflightPlacement } from "@/lib/events/schema";
import type { RecordedPenalty } from "./penalty-rules";
import { applyUndoAndCorrections, type TimelineEvent } from "./timeline";

/** A launch and (once it happens) its landing, in absolute timeline ms. */
export type RawFlight = {
  /** Position among the lane's flights in launch order (what the screens number). */
  index: number;
  launchAtMs: number;
  landAtMs: number | null;
  launchId: string;
  landId: string | null;
};

export type { InvalidReason } from "@/lib/events/schema";

export type LaneCall =
  | { kind: "target"; atMs: number; targetSec: number; id: string }
  | { kind: "end-call"; atMs: number; id: string };

/** Everything one pilot's lane recorded, with undo and corrections applied. */
export type LaneLog = {
  lane: number;
  flights: RawFlight[];
  /** Invalid marks by the launch event id of the flight they name. */
  invalid: Map<string, InvalidReason>;
  penalties: RecordedPenalty[];
  /** "Not signed" rulings (F3K.1.2), by event id. */
  unsigned: string[];
  /** Re-flights granted to the lane's pilot (F3K.9.6). */
  reflights: { id: string; cause: ReflightCause; placement: ReflightPlacement; reason: string | null }[];
  calls: LaneCall[];
  /** Taps that did not change the flights: a launch while flying, a landing with none open. */
  ignored: { id: string; reason: "launch-while-flying" | "landing-without-flight" }[];
};

export type RunLog = {
  /** Every effective window-start in time order (task C: one launch signal per attempt). */
  signalsMs: number[];
  runEndMs: number | null;
  lanes: LaneLog[];
};

/**
 * Pairs launches and landings per lane into flights.
 *
 * A landing closes the lane's open flight; a landing with no open flight is ignored, and
 * a launch while a flight is open is ignored. Nothing is debounced: a landing and a
 * launch 0.3 s apart are two real taps (RULES.md "common practice").
 * `laneCount` fixes the number of lanes; by default it is 1 + the highest lane seen.
 */
export function pairFlights(events: readonly TimelineEvent[], laneCount?: number): RunLog {
  const effective = applyUndoAndCorrections(events);
  const legacy = legacyInvalidTargets(events, effective);
  let lanesNeeded = laneCount ?? 1;
  if (laneCount === undefined) {
    for (const e of effective) if ("lane" in e.body) lanesNeeded = Math.max(lanesNeeded, e.body.lane + 1);
  }
  const state = startPairing(lanesNeeded);
  for (const e of effective) pairEvent(state, e, legacy);
  return { signalsMs: state.signalsMs, runEndMs: state.runEndMs, lanes: state.lanes };
}

/**
 * pairFlights' state between two events, so a fold can stop and resume (lib/results/fold-state.ts):
 * the run's log so far, each lane's open flight (its position in the lane's flights) and the
 * landing held for a launch at the same instant.
 */
export type PairingState = RunLog & { open: (number | null)[]; held: ({ atMs: number; id: string } | null)[] };

export function startPairing(laneCount: number): PairingState {
  const lanes: LaneLog[] = Array.from({ length: laneCount }, (_, lane) => ({
    lane,
    flights: [],
    invalid: new Map(),
    penalties: [],
    unsigned: [],
    reflights: [],
    calls: [],
    ignored: [],
  }));
  // A landing with no open flight at the same instant as a launch (a zero-length flight
  // whose taps sorted landing-first) is held until that launch, then applied.
  return { signalsMs: [], runEndMs: null, lanes, open: lanes.map(() => null), held: lanes.map(() => null) };
}

/** One effective event (in time order, after undo and corrections) into the pairing state. */
export function pairEvent(state: PairingState, e: TimelineEvent, legacy: ReadonlyMap<string, string>): void {
  const { lanes, open, held } = state;
  const body = e.body;
  if (body.kind === "window-start") state.signalsMs.push(e.atMs);
  else if (body.kind === "run-end") state.runEndMs = state.runEndMs === null ? e.atMs : Math.max(state.runEndMs, e.atMs);
  if (!("lane" in body)) return;
  const log = lanes[body.lane];
  if (!log) return; // a lane outside laneCount
  switch (body.kind) {
    case "launch": {
      if (open[body.lane] != null) {
        log.ignored.push({ id: e.id, reason: "launch-while-flying" });
        break;
      }
      const flight: RawFlight = { index: log.flights.length, launchAtMs: e.atMs, landAtMs: null, launchId: e.id, landId: null };
      log.flights.push(flight);
      open[body.lane] = flight.index;
      const landing = held[body.lane];
      if (landing && landing.atMs === e.atMs) {
        flight.landAtMs = landing.atMs;
        flight.landId = landing.id;
        open[body.lane] = null;
        held[body.lane] = null;
        log.ignored = log.ignored.filter((x) => x.id !== landing.id);
      }
      break;
    }
    case "landing": {
      const at = open[body.lane];
      const flight = at == null ? undefined : log.flights[at];
      if (!flight) {
        log.ignored.push({ id: e.id, reason: "landing-without-flight" });
        held[body.lane] = { atMs: e.atMs, id: e.id };
        break;
      }
      flight.landAtMs = e.atMs;
      flight.landId = e.id;
      open[body.lane] = null;
      break;
    }
    case "invalid": {
      const flightId = body.flightId ?? legacy.get(e.id);
      if (flightId) log.invalid.set(flightId, body.reason);
      break;
    }
    case "penalty":
      log.penalties.push({
        id: e.id,
        points: body.points,
        reason: body.reason,
        ...(body.cause ? { cause: body.cause } : {}),
        ...(body.launchId ? { launchId: body.launchId } : {}),
        ...(body.midAir ? { midAir: true } : {}),
      });
      break;
    case "unsigned":
      log.unsigned.push(e.id);
      break;
    case "reflight":
      log.reflights.push({ id: e.id, cause: body.cause, placement: body.placement, reason: body.reason ?? null });
      break;
    case "target":
      log.calls.push({ kind: "target", atMs: e.atMs, targetSec: body.targetSec, id: e.id });
      break;
    case "end-call":
      log.calls.push({ kind: "end-call", atMs: e.atMs, id: e.id });
      break;
  }
}

/**
 * Invalid marks recorded before marks named their flight by launch id carry its position
 * instead. Each is mapped once to the launch it meant: the flight at that position among the
 * flights as they stood when the mark was recorded (events up to its time, with the undos made
 * by then), so a later undo of another flight does not move it.
 */
export function legacyInvalidTargets(events: readonly TimelineEvent[], effective: readonly TimelineEvent[]): Map<string, string> {
  const out = new Map<string, string>();
  for (const mark of effective) {
    const body = mark.body;
    if (body.kind !== "invalid" || body.flightId !== undefined || body.flightIndex === undefined) continue;
    const before = events.filter((e) => e.atMs <= mark.atMs && e.id !== mark.id && e.body.kind !== "invalid");
    const flight = pairFlights(before).lanes[body.lane]?.flights[body.flightIndex];
    if (flight) out.set(mark.id, flight.launchId);
  }
  return out;
}
