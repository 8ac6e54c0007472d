import { foldRun, pointsLost, type LaneScore, type TimelineEvent } from "@/lib/tasks";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";
import { clockFlags, describeClockFlags } from "./clock-flags";
import { placeEvents, type ClockStep } from "./place";
import { describeReview, uncertainBoundaries, type TimedSignal } from "./review";
import { wasStarted } from "./started";
import { laneRulings, laneSources, rulingNotes, signalSources } from "./sources";
import type { DerivationEvent, DerivationInput, LaneDerivation, LaneVersion, Source } from "./types";

const finite = (n: number): number | null => (Number.isFinite(n) ? n : null);

const toTimeline = (e: DerivationEvent): TimelineEvent => ({ id: e.id, atMs: e.correctedMs, body: e.body });

/** The one result of a run: per lane, and the events that count, on the run's one timeline. */
export type RunResult = {
  lanes: LaneDerivation[];
  /** The events the results come from (the run's signals, each lane's chosen record and rulings), placed. */
  timeline: TimelineEvent[];
  /** Every wall-clock step seen in the run's records (lib/results/place.ts). */
  steps: ClockStep[];
  /** False for a window set up but never started (lib/results/started.ts): no result anywhere. */
  started: boolean;
};

/**
 * THE one path from a run's events to its results, used by the field screen (live and closed),
 * the logbook, the run page and the server's derivation (lib/sync/derive.ts), so they cannot
 * disagree. From all the run's events (SYNC.md §1, §3, §4): events go on the run's timeline
 * (lib/results/place.ts: corrected by the device's clock offset, durations inside one page
 * lifetime by the steady clock, wall-clock steps flagged for review); the conflict rules (./sources.ts)
 * pick one device's record for the run's signals and one per lane; the task engine folds them
 * with the rulings that count; every other device's record is scored the same way and kept as
 * a version, and rulings that do not count are kept as notes. Whether the result counts in a
 * pilot's own record is a separate question (lib/sync/consent.ts). A launch or landing judged
 * against a signal given on another device that the clocks cannot place (judgeBoundary →
 * "uncertain") marks the lane for review. Pure.
 */
export function runResult(input: DerivationInput): RunResult {
  const { events: placed, steps } = placeEvents(input.events, input.estimatesByDevice);
  const roles = { officials: input.officials, createdBy: input.createdBy };
  const laneCount = Math.max(1, ...input.lanes.map((l) => l.lane + 1));
  const signalSource = signalSources(placed, roles, toTimeline)[0] ?? null;
  const signalEvents = signalSource?.events ?? [];
  const signals = effectiveSignals(signalEvents);
  const ended = applyUndoAndCorrections(signalEvents.map(toTimeline)).some((e) => e.body.kind === "run-end");

  // A window set up but never started is left out of results: no lane has one (not 0.0).
  const started = wasStarted(placed);
  const counted = new Map<string, DerivationEvent>();
  for (const e of signalEvents) counted.set(e.id, e);
  const lanes = input.lanes.map(({ lane, pilotUserId }): LaneDerivation => {
    const candidates = laneSources(placed, lane, pilotUserId, roles, toTimeline);
    const chosen = candidates[0] ?? null;
    const rulings = laneRulings(placed, lane, input.officials, new Set(candidates.map((c) => c.deviceId)));
    const notesRaw = rulingNotes(placed, lane, new Set([...(chosen?.events ?? []), ...rulings].map((e) => e.id)), toTimeline);
    const score = (source: Source | null, lane: number): LaneScore =>
      foldRun(input.task, [...signalEvents, ...rulings, ...(source?.events ?? [])].map(toTimeline), { laneCount }).lanes[lane]!;
    const laneScore = score(chosen, lane);
    const notes = notesRaw.map((n) => (n.flightId ? { ...n, flightIndex: laneScore.flights.find((f) => f.launchId === n.flightId)?.index ?? null } : n));
    for (const e of [...rulings, ...(chosen?.events ?? [])]) counted.set(e.id, e);
    const versions = candidates.map((c, i): LaneVersion => {
      const s = i === 0 ? laneScore : score(c, lane);
      return {
        deviceId: c.deviceId,
        recordedBy: c.recordedBy,
        official: c.official,
        chosen: i === 0,
        resultTenths: s.resultTenths,
        firstAtMs: c.firstAtMs,
        uncertaintyMs: finite(Math.max(0, ...c.events.map((e) => e.uncertaintyMs))),
        eventCount: c.events.length,
        flights: s.flights.map((f) => ({ launchAtMs: f.launchAtMs, landAtMs: f.landAtMs })),
      };
    });

    const crossDevice = chosen !== null && signalSource !== null && chosen.deviceId !== signalSource.deviceId;
    const review = crossDevice ? uncertainBoundaries(input.task, laneScore, signals, laneUncertainty(chosen)) : [];
    const flightOf = (eventId: string) => laneScore.flights.find((f) => f.launchId === eventId)?.index ?? null;
    const clock = chosen ? clockFlags(steps, chosen.events, laneScore) : [];
    const reasons = [describeReview(review, flightOf), describeClockFlags(clock)].filter((r): r is string => r !== null);

    return {
      lane,
      resultTenths: chosen && started ? laneScore.resultTenths : null,
      penaltyPoints: laneScore.penaltyPoints,
      needsReview: review.length > 0 || clock.length > 0,
      reviewReason: reasons.length > 0 ? reasons.join("; ") : null,
      derived: {
        signal: signalSource && {
          deviceId: signalSource.deviceId,
          official: signalSource.official,
          atMs: signals.map((s) => s.atMs),
          uncertaintyMs: finite(Math.max(0, ...signals.map((s) => s.uncertaintyMs))),
        },
        source: chosen && { deviceId: chosen.deviceId, official: chosen.official },
        flights: laneScore.flights.map((f) => ({
          index: f.index, launchMs: f.launchMs, landMs: f.landMs, launchAtMs: f.launchAtMs, landAtMs: f.landAtMs, status: f.status, reason: f.reason,
          timeTenths: f.timeTenths, creditedTenths: f.creditedTenths, targetSec: f.targetSec,
        })),
        breakdown: chosen ? pointsLost(input.task, laneScore) : null,
        versions,
        review,
        clock,
        notes,
        ended,
      },
    };
  });
  return { lanes, timeline: [...counted.values()].map(toTimeline), steps, started };
}

/** The chosen signal record's effective window starts, in order, with their bounds. */
function effectiveSignals(events: readonly DerivationEvent[]): TimedSignal[] {
  const unc = new Map(events.map((e) => [e.id, e.uncertaintyMs]));
  return applyUndoAndCorrections(events.map(toTimeline))
    .filter((e) => e.body.kind === "window-start")
    .map((e) => ({ atMs: e.atMs, uncertaintyMs: unc.get(e.id) ?? Number.POSITIVE_INFINITY }));
}

function laneUncertainty(source: Source) {
  const byId = new Map(source.events.map((e) => [e.id, e.uncertaintyMs]));
  const landings = applyUndoAndCorrections(source.events.map(toTimeline)).filter((e) => e.body.kind === "landing");
  return {
    launch: (id: string) => byId.get(id) ?? Number.POSITIVE_INFINITY,
    landing: (atMs: number) => {
      const hit = landings.find((e) => e.atMs === atMs);
      return hit ? (byId.get(hit.id) ?? Number.POSITIVE_INFINITY) : Number.POSITIVE_INFINITY;
    },
  };
}
