import { foldRun, type LaneScore, type TimelineEvent } from "@/lib/tasks";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";
import { clockFlags } from "./clock-flags";
import { assembleLane } from "./lane-derivation";
import { placeEvents, type ClockStep } from "./place";
import type { LaneUncertainty, TimedSignal } from "./review";
import { wasStarted } from "./started";
import { laneRulings, laneSources, rulingNotes, signalSources } from "./sources";
import type { DerivationEvent, DerivationInput, LaneDerivation, Source } from "./types";

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
 * pick one device's record for the run's signals and one per lane (unless `standing` names one chosen
 * by hand: a club day's decision); the task engine folds them
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
    const candidates = chosenFirst(laneSources(placed, lane, pilotUserId, roles, toTimeline), input.standing?.get(lane));
    const chosen = candidates[0] ?? null;
    const rulings = laneRulings(placed, lane, input.officials, new Set(candidates.map((c) => c.deviceId)));
    const notes = rulingNotes(placed, lane, new Set([...(chosen?.events ?? []), ...rulings].map((e) => e.id)), toTimeline);
    const score = (source: Source | null): LaneScore =>
      foldRun(input.task, [...signalEvents, ...rulings, ...(source?.events ?? [])].map(toTimeline), { laneCount }).lanes[lane]!;
    for (const e of [...rulings, ...(chosen?.events ?? [])]) counted.set(e.id, e);
    return assembleLane({
      task: input.task,
      lane,
      started,
      ended,
      signalSource: signalSource && { deviceId: signalSource.deviceId, official: signalSource.official },
      signals,
      candidates: candidates.map((c) => ({
        deviceId: c.deviceId, recordedBy: c.recordedBy, official: c.official, firstAtMs: c.firstAtMs,
        maxUncertaintyMs: Math.max(...c.events.map((e) => e.uncertaintyMs)), eventCount: c.events.length,
      })),
      scores: chosen ? candidates.map(score) : [score(null)],
      notes,
      uncertainty: () => laneUncertainty(chosen!),
      clock: (laneScore) => clockFlags(steps, chosen!.events, laneScore),
    });
  });
  return { lanes, timeline: [...counted.values()].map(toTimeline), steps, started };
}

/** The candidates with the record chosen by hand (DerivationInput.standing) first, when it is one of them. */
function chosenFirst(candidates: Source[], deviceId: string | undefined): Source[] {
  const i = deviceId === undefined ? -1 : candidates.findIndex((c) => c.deviceId === deviceId);
  return i <= 0 ? candidates : [candidates[i]!, ...candidates.slice(0, i), ...candidates.slice(i + 1)];
}

/** The chosen signal record's effective window starts, in order, with their bounds. */
export function effectiveSignals(events: readonly DerivationEvent[]): TimedSignal[] {
  const unc = new Map(events.map((e) => [e.id, e.uncertaintyMs]));
  return applyUndoAndCorrections(events.map(toTimeline))
    .filter((e) => e.body.kind === "window-start")
    .map((e) => ({ atMs: e.atMs, uncertaintyMs: unc.get(e.id) ?? Number.POSITIVE_INFINITY }));
}

export function laneUncertainty(source: Pick<Source, "events">): LaneUncertainty {
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
