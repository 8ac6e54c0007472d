import { pointsLost, type LaneScore, type TaskDefinition } from "@/lib/tasks";
import { describeClockFlags } from "./clock-flags";
import { describeReview, uncertainBoundaries, type LaneUncertainty, type TimedSignal } from "./review";
import type { ClockFlag, LaneDerivation, LaneVersion, RulingNote } from "./types";

const finite = (n: number): number | null => (Number.isFinite(n) ? n : null);

/** One device's record of a lane as the result shows it (a version), without its events. */
export type CandidateFacts = {
  deviceId: string;
  recordedBy: string;
  official: boolean;
  firstAtMs: number;
  /** Largest uncertainty among its events (Infinity: a clock never measured). */
  maxUncertaintyMs: number;
  eventCount: number;
};

/** Everything a lane's stored derivation is made of, however it was folded (run-result.ts, fold-state.ts). */
export type LaneParts = {
  task: TaskDefinition;
  lane: number;
  started: boolean;
  ended: boolean;
  signalSource: { deviceId: string; official: boolean } | null;
  /** The chosen signal record's effective window starts, in order. */
  signals: readonly TimedSignal[];
  /** The lane's records, best first (lib/results/sources.ts). */
  candidates: readonly CandidateFacts[];
  /** Each candidate's score, same order; with no candidate, one score: the signals and rulings alone. */
  scores: readonly LaneScore[];
  /** Rulings that do not count, their flightIndex still to be read from the result. */
  notes: readonly RulingNote[];
  /** The chosen record's uncertainties: asked only when it was timed on another device than the signals. */
  uncertainty: () => LaneUncertainty;
  /** The chosen record's clock flags (lib/results/clock-flags.ts). */
  clock: (score: LaneScore) => ClockFlag[];
};

/** The lane's derivation as run_lanes stores it: ONE assembly for the full and the incremental fold. */
export function assembleLane(p: LaneParts): LaneDerivation {
  const chosen = p.candidates[0] ?? null;
  const laneScore = p.scores[0]!;
  const notes = p.notes.map((n) => (n.flightId ? { ...n, flightIndex: laneScore.flights.find((f) => f.launchId === n.flightId)?.index ?? null } : n));
  const versions = p.candidates.map((c, i): LaneVersion => {
    const s = p.scores[i]!;
    return {
      deviceId: c.deviceId,
      recordedBy: c.recordedBy,
      official: c.official,
      chosen: i === 0,
      resultTenths: s.resultTenths,
      firstAtMs: c.firstAtMs,
      uncertaintyMs: finite(Math.max(0, c.maxUncertaintyMs)),
      eventCount: c.eventCount,
      flights: s.flights.map((f) => ({ launchAtMs: f.launchAtMs, landAtMs: f.landAtMs })),
    };
  });
  const crossDevice = chosen !== null && p.signalSource !== null && chosen.deviceId !== p.signalSource.deviceId;
  const review = crossDevice ? uncertainBoundaries(p.task, laneScore, p.signals, p.uncertainty()) : [];
  const flightOf = (eventId: string) => laneScore.flights.find((f) => f.launchId === eventId)?.index ?? null;
  const clock = chosen ? p.clock(laneScore) : [];
  const reasons = [describeReview(review, flightOf), describeClockFlags(clock)].filter((r): r is string => r !== null);
  return {
    lane: p.lane,
    resultTenths: chosen && p.started ? laneScore.resultTenths : null,
    penaltyPoints: laneScore.penaltyPoints,
    needsReview: review.length > 0 || clock.length > 0,
    reviewReason: reasons.length > 0 ? reasons.join("; ") : null,
    derived: {
      signal: p.signalSource && {
        deviceId: p.signalSource.deviceId,
        official: p.signalSource.official,
        atMs: p.signals.map((s) => s.atMs),
        uncertaintyMs: finite(Math.max(0, ...p.signals.map((s) => s.uncertaintyMs))),
      },
      source: chosen && { deviceId: chosen.deviceId, official: chosen.official },
      flights: laneScore.flights.map((f) => ({
        index: f.index, launchMs: f.launchMs, landMs: f.landMs, launchAtMs: f.launchAtMs, landAtMs: f.landAtMs, status: f.status, reason: f.reason,
        timeTenths: f.timeTenths, creditedTenths: f.creditedTenths, targetSec: f.targetSec,
      })),
      breakdown: chosen ? pointsLost(p.task, laneScore) : null,
      versions,
      review,
      clock,
      notes,
      penalties: chosen ? laneScore.penalties.map((v) => ({ eventId: v.id, points: v.points, cause: v.cause ?? null, reason: v.reason, applied: v.applied, dropped: v.dropped })) : [],
      ended: p.ended,
    },
  };
}
