import { correctTime } from "@/lib/clock";
import { foldRun, pointsLost, type LaneScore, type TimelineEvent } from "@/lib/tasks";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";
import { describeReview, uncertainBoundaries, type TimedSignal } from "./review";
import { laneRulings, laneSources, rulingNotes, signalSources } from "./sources";
import type { DerivationEvent, DerivationInput, LaneDerivation, LaneVersion, Source } from "./types";

export type { DerivationEvent, DerivationInput, LaneDerivation, LaneDerived, LaneVersion, ReviewItem, RulingNote } from "./types";

const finite = (n: number): number | null => (Number.isFinite(n) ? n : null);

/**
 * A `correct` names a new wall time on the clock of the event it moves (lib/events/schema.ts);
 * on the server timeline that is the target device's wall time corrected like a stamp.
 */
function timelineMapper(input: DerivationInput): (e: DerivationEvent) => TimelineEvent {
  const byId = new Map(input.events.map((e) => [e.id, e]));
  return (e) => {
    if (e.body.kind !== "correct") return { id: e.id, atMs: e.correctedMs, body: e.body };
    const target = byId.get(e.body.targetId) ?? e;
    const estimates = input.estimatesByDevice.get(target.deviceId) ?? [];
    const moved = correctTime({ ...target.stamp, wallMs: e.body.wallMs }, estimates);
    return { id: e.id, atMs: e.correctedMs, body: { ...e.body, wallMs: moved.serverMs } };
  };
}

/**
 * The result of every lane of a run from all its stored events (SYNC.md §1, §3, §4): events go
 * on the server timeline by their corrected times; the conflict rules (lib/sync/sources.ts)
 * pick one device's record for the run's signals and one per lane; the task engine folds them
 * with the rulings that count; every other device's record is scored the same way and kept as
 * a version, and rulings that do not count are kept as notes. Whether the result counts in a
 * pilot's own record is a separate question (lib/sync/consent.ts). A launch or landing judged
 * against a signal given on another device that the clocks cannot place (judgeBoundary →
 * "uncertain") marks the lane for review. Pure.
 */
export function deriveRun(input: DerivationInput): LaneDerivation[] {
  const toTimeline = timelineMapper(input);
  const roles = { officials: input.officials, createdBy: input.createdBy };
  const laneCount = Math.max(1, ...input.lanes.map((l) => l.lane + 1));
  const signalSource = signalSources(input.events, roles, toTimeline)[0] ?? null;
  const signalEvents = signalSource?.events ?? [];
  const signals = effectiveSignals(signalEvents, toTimeline);
  const ended = applyUndoAndCorrections(signalEvents.map(toTimeline)).some((e) => e.body.kind === "run-end");

  return input.lanes.map(({ lane, pilotUserId }): LaneDerivation => {
    const candidates = laneSources(input.events, lane, pilotUserId, roles, toTimeline);
    const chosen = candidates[0] ?? null;
    const rulings = laneRulings(input.events, lane, input.officials, new Set(candidates.map((c) => c.deviceId)));
    const notes = rulingNotes(input.events, lane, new Set([...(chosen?.events ?? []), ...rulings].map((e) => e.id)), toTimeline);
    const score = (source: Source | null, lane: number): LaneScore =>
      foldRun(input.task, [...signalEvents, ...rulings, ...(source?.events ?? [])].map(toTimeline), { laneCount }).lanes[lane]!;
    const laneScore = score(chosen, lane);
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
    const review = crossDevice ? uncertainBoundaries(input.task, laneScore, signals, laneUncertainty(chosen, toTimeline)) : [];
    const flightOf = (eventId: string) => laneScore.flights.find((f) => f.launchId === eventId)?.index ?? null;

    return {
      lane,
      resultTenths: chosen ? laneScore.resultTenths : null,
      penaltyPoints: laneScore.penaltyPoints,
      needsReview: review.length > 0,
      reviewReason: describeReview(review, flightOf),
      derived: {
        signal: signalSource && {
          deviceId: signalSource.deviceId,
          official: signalSource.official,
          atMs: signals.map((s) => s.atMs),
          uncertaintyMs: finite(Math.max(0, ...signals.map((s) => s.uncertaintyMs))),
        },
        source: chosen && { deviceId: chosen.deviceId, official: chosen.official },
        flights: laneScore.flights.map((f) => ({
          index: f.index, launchMs: f.launchMs, landMs: f.landMs, status: f.status, reason: f.reason,
          timeTenths: f.timeTenths, creditedTenths: f.creditedTenths, targetSec: f.targetSec,
        })),
        breakdown: chosen ? pointsLost(input.task, laneScore) : null,
        versions,
        review,
        notes,
        ended,
      },
    };
  });
}

/** The chosen signal record's effective window starts, in order, with their bounds. */
function effectiveSignals(events: readonly DerivationEvent[], toTimeline: (e: DerivationEvent) => TimelineEvent): TimedSignal[] {
  const unc = new Map(events.map((e) => [e.id, e.uncertaintyMs]));
  return applyUndoAndCorrections(events.map(toTimeline))
    .filter((e) => e.body.kind === "window-start")
    .map((e) => ({ atMs: e.atMs, uncertaintyMs: unc.get(e.id) ?? Number.POSITIVE_INFINITY }));
}

function laneUncertainty(source: Source, toTimeline: (e: DerivationEvent) => TimelineEvent) {
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
