import { SLEEP_TOLERANCE_MS } from "@/lib/clock";
import type { EventKind } from "@/lib/events/schema";
import { legacyInvalidTargets, pairEvent, startPairing, type LaneLog, type PairingState } from "@/lib/tasks/flights";
import { scoreLane, type LaneScore } from "@/lib/tasks/score";
import { applyUndoAndCorrections, type TimelineEvent } from "@/lib/tasks/timeline";
import type { TaskDefinition } from "@/lib/tasks";
import { assembleLane, type CandidateFacts } from "./lane-derivation";
import { anchorOf, placeEvents, type RecordedEvent } from "./place";
import { effectiveSignals } from "./run-result";
import { laneRulings, laneSources, rulingNotes, signalSources } from "./sources";
import { wasStarted } from "./started";
import type { DerivationEvent, DerivationInput, LaneDerivation, RulingNote } from "./types";

/**
 * Incremental derivation: a run's folded state (stored per run, run_folds) from which the next
 * push derives the run from its NEW events only, giving exactly what runResult gives over all
 * the run's events (tests/unit/results/fold-state.test.ts checks it over random sequences, batches
 * and arrival orders).
 *
 * The state keeps what each stage of runResult needs to go on: per page lifetime its anchor and last
 * event (placement, clock-step detection); which device gives the signals and which records each
 * lane has, in rank order (the conflict rules); per record the task engine's pairing state
 * (lib/tasks/flights.ts pairEvent) after its effective events; the ruling notes; whether the run
 * started and ended. Scoring (timing, counting, sum cap) is re-run over the record's flights at every
 * push: it is over flights, not events, and has no state to resume.
 *
 * New events fold in only when that is exactly what a full derivation would do; otherwise the caller
 * derives from all events (`resumeFold` says why). Falls back when:
 * - the stored state is of another FOLD_VERSION, or the run's task, creator or lanes changed;
 * - a device's clock estimates moved the anchor of a page lifetime already folded;
 * - a new event is a void, a correction or a ruling (penalty, invalid, unsigned, re-flight), or an
 *   earlier void or correction names it;
 * - a new event is not after its page lifetime's last folded one (steady clock, then seq), or the
 *   wall and steady clocks disagree (a clock step: the result then shows clock flags);
 * - a new event is not strictly later on the run's timeline than every folded event of the record
 *   it joins (an out-of-order arrival: an earlier tap sent late, or a phone's slower outbox);
 * - it could change the records' ranks (the conflict rules): a device timing a lane it had not, or a
 *   window start from another device than the one whose signals count;
 * - the run has contest officials (none on the server yet), or a clock step anywhere (no state is kept).
 */
export const FOLD_VERSION = 1;

/** JSON has no Infinity: an unbounded uncertainty is stored as null. */
type Unc = number | null;
const enc = (n: number): Unc => (Number.isFinite(n) ? n : null);
const dec = (n: Unc): number => (n === null ? Number.POSITIVE_INFINITY : n);

type Segment = { key: string; first: RecordedEvent; anchor: { monoMs: number; atMs: number; unc: Unc }; last: { monoMs: number; seq: number; wallMs: number } };

type StoredLog = Omit<LaneLog, "invalid"> & { invalid: [string, LaneLog["invalid"] extends Map<string, infer V> ? V : never][] };

/** One record's pairing after its effective events: the signals, its lane's log, open flight and held landing. */
type Stream = {
  /** The latest place on the timeline among its effective events (null: none). */
  lastAtMs: number | null;
  signalsMs: number[];
  runEndMs: number | null;
  log: StoredLog;
  open: number | null;
  held: { atMs: number; id: string } | null;
};

type CandidateFold = Omit<CandidateFacts, "maxUncertaintyMs"> & {
  maxUnc: Unc;
  stream: Stream;
  /** The chosen record's uncertainties, kept when it was timed on another device than the signals. */
  unc: { launches: [string, Unc][]; landings: [number, Unc][] } | null;
};

type LaneFold = { lane: number; candidates: CandidateFold[]; base: Stream | null; notes: RulingNote[] };

export type RunFold = {
  v: number;
  /** The run's task, creator and lanes the state was folded for. */
  key: string;
  eventCount: number;
  segments: Segment[];
  started: boolean;
  ended: boolean;
  signal: { deviceId: string; official: boolean; recordedBy: string; signals: [number, Unc][]; lastAtMs: number | null } | null;
  /** Ids a void or correction names. */
  amended: string[];
  lanes: LaneFold[];
};

type RunFacts = Pick<DerivationInput, "task" | "createdBy" | "lanes" | "officials" | "estimatesByDevice">;

/** A page lifetime (place.ts groups by device and page the same way); no NUL: jsonb cannot hold one. */
const segmentKey = (deviceId: string, pageId: string) => JSON.stringify([deviceId, pageId]);
const toTimeline = (e: DerivationEvent): TimelineEvent => ({ id: e.id, atMs: e.correctedMs, body: e.body });
const keyOf = (f: RunFacts) => JSON.stringify([f.task, f.createdBy, f.lanes.map((l) => [l.lane, l.pilotUserId])]);
const laneCountOf = (f: Pick<RunFacts, "lanes">) => Math.max(1, ...f.lanes.map((l) => l.lane + 1));
const SIGNAL_KINDS: ReadonlySet<EventKind> = new Set(["window-start", "run-end"]);
const LANE_KINDS: ReadonlySet<EventKind> = new Set(["launch", "landing", "target", "end-call"]);
const NEUTRAL_KINDS: ReadonlySet<EventKind> = new Set(["model"]);

function storeStream(state: PairingState, lane: number, lastAtMs: number | null): Stream {
  const log = state.lanes[lane]!;
  return {
    lastAtMs, signalsMs: state.signalsMs, runEndMs: state.runEndMs,
    log: { ...log, invalid: [...log.invalid] }, open: state.open[lane] ?? null, held: state.held[lane] ?? null,
  };
}

function pairingOf(s: Stream, lane: number, laneCount: number): PairingState {
  const state = startPairing(laneCount);
  state.signalsMs = s.signalsMs;
  state.runEndMs = s.runEndMs;
  state.lanes[lane] = { ...s.log, invalid: new Map(s.log.invalid) };
  state.open[lane] = s.open;
  state.held[lane] = s.held;
  return state;
}

/** Folds a record's events (signals, rulings and its own, as runResult concatenates them) from nothing. */
function foldStream(events: readonly DerivationEvent[], lane: number, laneCount: number): Stream {
  const timeline = events.map(toTimeline);
  const effective = applyUndoAndCorrections(timeline);
  const legacy = legacyInvalidTargets(timeline, effective);
  const state = startPairing(laneCount);
  for (const e of effective) pairEvent(state, e, legacy);
  return storeStream(state, lane, effective.at(-1)?.atMs ?? null);
}

function scoreOf(task: TaskDefinition, s: Stream, lane: number, laneCount: number): LaneScore {
  const state = pairingOf(s, lane, laneCount);
  return scoreLane(task, state, state.lanes[lane]!, null);
}

/** The lanes' derivations from a folded state (the same assembly runResult uses). */
export function lanesOfFold(fold: RunFold, facts: Pick<RunFacts, "task" | "lanes">): LaneDerivation[] {
  const laneCount = laneCountOf(facts);
  const signals = (fold.signal?.signals ?? []).map(([atMs, u]) => ({ atMs, uncertaintyMs: dec(u) }));
  return fold.lanes.map((l) => {
    const chosen = l.candidates[0];
    const streams = chosen ? l.candidates.map((c) => c.stream) : [l.base!];
    return assembleLane({
      task: facts.task,
      lane: l.lane,
      started: fold.started,
      ended: fold.ended,
      signalSource: fold.signal && { deviceId: fold.signal.deviceId, official: fold.signal.official },
      signals,
      candidates: l.candidates.map((c) => ({
        deviceId: c.deviceId, recordedBy: c.recordedBy, official: c.official, firstAtMs: c.firstAtMs, maxUncertaintyMs: dec(c.maxUnc), eventCount: c.eventCount,
      })),
      scores: streams.map((s) => scoreOf(facts.task, s, l.lane, laneCount)),
      notes: l.notes,
      uncertainty: () => {
        const u = chosen?.unc;
        if (!u) throw new Error("fold: a cross-device record without its uncertainties");
        const launches = new Map(u.launches);
        return {
          launch: (id: string) => dec(launches.get(id) ?? null),
          landing: (atMs: number) => dec(u.landings.find(([at]) => at === atMs)?.[1] ?? null),
        };
      },
      clock: () => [], // a run with a clock step keeps no folded state
    });
  });
}

/**
 * The folded state of a run from ALL its events (in id order, as runResult takes them), or null
 * when the run is one the fold does not follow (officials, a clock step).
 */
export function buildFold(input: DerivationInput): RunFold | null {
  if (input.officials.size > 0) return null;
  const { events: placed, steps } = placeEvents(input.events, input.estimatesByDevice);
  if (steps.length > 0) return null;
  const laneCount = laneCountOf(input);
  const roles = { officials: input.officials, createdBy: input.createdBy };

  const pages = new Map<string, RecordedEvent[]>();
  for (const e of input.events) {
    const k = segmentKey(e.deviceId, e.stamp.pageId);
    pages.set(k, [...(pages.get(k) ?? []), e]);
  }
  const segments: Segment[] = [...pages].map(([key, list]) => {
    const ordered = [...list].sort((a, b) => a.stamp.monoMs - b.stamp.monoMs || (a.seq ?? 0) - (b.seq ?? 0));
    const first = ordered[0]!;
    const last = ordered.at(-1)!;
    const a = anchorOf(first, input.estimatesByDevice);
    return { key, first: plain(first), anchor: { monoMs: a.monoMs, atMs: a.atMs, unc: enc(a.uncertaintyMs) }, last: { monoMs: last.stamp.monoMs, seq: last.seq ?? 0, wallMs: last.stamp.wallMs } };
  });

  const signalCandidates = signalSources(placed, roles, toTimeline);
  const signalSource = signalCandidates[0] ?? null;
  const signalEvents = signalSource?.events ?? [];
  const signalEffective = applyUndoAndCorrections(signalEvents.map(toTimeline));

  const lanes = input.lanes.map(({ lane, pilotUserId }): LaneFold => {
    const candidates = laneSources(placed, lane, pilotUserId, roles, toTimeline);
    const rulings = laneRulings(placed, lane, input.officials, new Set(candidates.map((c) => c.deviceId)));
    const chosen = candidates[0] ?? null;
    const notes = rulingNotes(placed, lane, new Set([...(chosen?.events ?? []), ...rulings].map((e) => e.id)), toTimeline);
    const crossDevice = chosen !== null && signalSource !== null && chosen.deviceId !== signalSource.deviceId;
    return {
      lane,
      notes,
      base: chosen ? null : foldStream([...signalEvents, ...rulings], lane, laneCount),
      candidates: candidates.map((c, i): CandidateFold => ({
        deviceId: c.deviceId, recordedBy: c.recordedBy, official: c.official, firstAtMs: c.firstAtMs,
        maxUnc: enc(Math.max(...c.events.map((e) => e.uncertaintyMs))), eventCount: c.events.length,
        stream: foldStream([...signalEvents, ...rulings, ...c.events], lane, laneCount),
        unc: i === 0 && crossDevice ? uncertaintiesOf(c.events) : null,
      })),
    };
  });

  return {
    v: FOLD_VERSION,
    key: keyOf(input),
    eventCount: input.events.length,
    segments,
    started: wasStarted(placed),
    ended: signalEffective.some((e) => e.body.kind === "run-end"),
    signal: signalSource && {
      deviceId: signalSource.deviceId, official: signalSource.official, recordedBy: signalSource.recordedBy,
      signals: effectiveSignals(signalEvents).map((s) => [s.atMs, enc(s.uncertaintyMs)]),
      lastAtMs: signalEffective.at(-1)?.atMs ?? null,
    },
    amended: input.events.flatMap((e) => (e.body.kind === "void" || e.body.kind === "correct" ? [e.body.targetId] : [])),
    lanes,
  };
}

/** The record's effective launches and landings with their uncertainties, as laneUncertainty reads them. */
function uncertaintiesOf(events: readonly DerivationEvent[]): NonNullable<CandidateFold["unc"]> {
  const out: NonNullable<CandidateFold["unc"]> = { launches: [], landings: [] };
  appendUncertainties(out, events);
  return out;
}

/** Adds these events' effective launches and landings (after their own undos) to `unc`. */
function appendUncertainties(unc: NonNullable<CandidateFold["unc"]>, events: readonly DerivationEvent[]): void {
  const byId = new Map(events.map((e) => [e.id, e.uncertaintyMs]));
  for (const e of applyUndoAndCorrections(events.map(toTimeline))) {
    const u = enc(byId.get(e.id) ?? Number.POSITIVE_INFINITY);
    if (e.body.kind === "launch") unc.launches.push([e.id, u]);
    else if (e.body.kind === "landing") unc.landings.push([e.atMs, u]);
  }
}

const plain = (e: RecordedEvent): RecordedEvent => ({ id: e.id, deviceId: e.deviceId, seq: e.seq, recordedBy: e.recordedBy, stamp: e.stamp, body: e.body });

export type Resumed = { ok: true; fold: RunFold; lanes: LaneDerivation[] } | { ok: false; reason: string };

/**
 * Folds `added` (events stored since the state was folded, any order) into `fold`, or says why a
 * full derivation is needed. `eventCount` is the run's number of stored events after them: a state
 * that does not account for exactly those is not used. Leaves `stored` as it was, unless `owned`: the
 * caller gives it up (a state just read from the database, used once), and it is folded in place
 * instead of being copied first (a long run's state is ~400 kB; the copy cost ~2 ms per push). After
 * an `owned` call, ok or not, `stored` must not be read again.
 */
export function resumeFold(stored: RunFold, facts: RunFacts, added: readonly RecordedEvent[], eventCount: number, owned = false): Resumed {
  if (stored.v !== FOLD_VERSION) return { ok: false, reason: "the fold's code changed" };
  if (facts.officials.size > 0) return { ok: false, reason: "the run has officials" };
  if (stored.key !== keyOf(facts)) return { ok: false, reason: "the run's task, creator or lanes changed" };
  if (stored.eventCount + added.length !== eventCount) return { ok: false, reason: "events were stored or removed outside the fold" };
  const fold: RunFold = owned ? stored : structuredClone(stored);
  const amended = new Set(fold.amended);
  for (const e of added) {
    if (!LANE_KINDS.has(e.body.kind) && !SIGNAL_KINDS.has(e.body.kind) && !NEUTRAL_KINDS.has(e.body.kind)) return { ok: false, reason: `a new ${e.body.kind}` };
    if (amended.has(e.id)) return { ok: false, reason: "an earlier void or correction names a new event" };
  }

  // placement: the folded page lifetimes keep their anchors; new events go after their page's last
  const segments = new Map(fold.segments.map((s) => [s.key, s]));
  for (const s of fold.segments) {
    const a = anchorOf(s.first, facts.estimatesByDevice);
    if (a.atMs !== s.anchor.atMs || enc(a.uncertaintyMs) !== s.anchor.unc) return { ok: false, reason: "clock estimates moved a folded page" };
  }
  const ordered = [...added].sort((a, b) => a.stamp.monoMs - b.stamp.monoMs || (a.seq ?? 0) - (b.seq ?? 0));
  const placed: DerivationEvent[] = [];
  for (const e of ordered) {
    const key = segmentKey(e.deviceId, e.stamp.pageId);
    let s = segments.get(key);
    if (!s) {
      const a = anchorOf(e, facts.estimatesByDevice);
      s = { key, first: plain(e), anchor: { monoMs: a.monoMs, atMs: a.atMs, unc: enc(a.uncertaintyMs) }, last: { monoMs: e.stamp.monoMs, seq: e.seq ?? 0, wallMs: e.stamp.wallMs } };
      segments.set(key, s);
      fold.segments.push(s);
    } else {
      const seq = e.seq ?? 0;
      if (e.stamp.monoMs < s.last.monoMs || (e.stamp.monoMs === s.last.monoMs && seq <= s.last.seq)) return { ok: false, reason: "an event earlier than its page's last folded one" };
      if (Math.abs(e.stamp.wallMs - s.last.wallMs - (e.stamp.monoMs - s.last.monoMs)) > SLEEP_TOLERANCE_MS) return { ok: false, reason: "a clock step" };
      s.last = { monoMs: e.stamp.monoMs, seq, wallMs: e.stamp.wallMs };
    }
    placed.push({ ...e, correctedMs: s.anchor.atMs + (e.stamp.monoMs - s.anchor.monoMs), uncertaintyMs: dec(s.anchor.unc) });
  }
  // in id order from here, as runResult reads them
  placed.sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));

  const newSignals: DerivationEvent[] = [];
  const newLane = new Map<number, Map<string, DerivationEvent[]>>();
  for (const e of placed) {
    if (e.body.kind === "window-start" || e.body.kind === "launch") fold.started = true;
    if (SIGNAL_KINDS.has(e.body.kind)) {
      if (fold.signal && e.deviceId === fold.signal.deviceId) {
        if (e.recordedBy !== fold.signal.recordedBy) return { ok: false, reason: "another account on the signals' device" };
        newSignals.push(e);
      } else if (e.body.kind === "window-start") return { ok: false, reason: "a window start from another device than the signals' (it may rank first)" };
      continue;
    }
    if (!LANE_KINDS.has(e.body.kind) || !("lane" in e.body)) continue; // a model choice: placed, in no record
    const lane = fold.lanes.find((l) => l.lane === (e.body as { lane: number }).lane);
    if (!lane) continue; // a lane the run does not have
    const c = lane.candidates.find((x) => x.deviceId === e.deviceId);
    if (!c) return { ok: false, reason: "a new record of a lane" };
    if (c.recordedBy !== e.recordedBy) return { ok: false, reason: "another account on a lane's device" };
    const byDevice = newLane.get(lane.lane) ?? new Map<string, DerivationEvent[]>();
    byDevice.set(e.deviceId, [...(byDevice.get(e.deviceId) ?? []), e]);
    newLane.set(lane.lane, byDevice);
  }

  if (fold.signal && newSignals.length > 0) {
    const eff = applyUndoAndCorrections(newSignals.map(toTimeline));
    if (fold.signal.lastAtMs !== null && eff[0]!.atMs <= fold.signal.lastAtMs) return { ok: false, reason: "a signal earlier than the folded ones" };
    for (const e of eff) {
      if (e.body.kind === "window-start") fold.signal.signals.push([e.atMs, enc(newSignals.find((x) => x.id === e.id)!.uncertaintyMs)]);
      if (e.body.kind === "run-end") fold.ended = true;
    }
    fold.signal.lastAtMs = eff.at(-1)!.atMs;
  }

  const laneCount = laneCountOf(facts);
  for (const l of fold.lanes) {
    const byDevice = newLane.get(l.lane);
    const streams: [Stream, DerivationEvent[], CandidateFold | null][] = l.candidates.length
      ? l.candidates.map((c) => [c.stream, byDevice?.get(c.deviceId) ?? [], c])
      : [[l.base!, [], null]];
    for (const [stream, own, c] of streams) {
      const fresh = [...newSignals, ...own];
      if (fresh.length === 0) continue;
      const eff = applyUndoAndCorrections(fresh.map(toTimeline));
      if (stream.lastAtMs !== null && eff[0]!.atMs <= stream.lastAtMs) return { ok: false, reason: "an event earlier than the folded ones of its record" };
      const state = pairingOf(stream, l.lane, laneCount);
      for (const e of eff) pairEvent(state, e, new Map());
      const next = storeStream(state, l.lane, eff.at(-1)!.atMs);
      Object.assign(stream, next);
      if (c && own.length > 0) {
        c.eventCount += own.length;
        c.maxUnc = enc(Math.max(dec(c.maxUnc), ...own.map((e) => e.uncertaintyMs)));
        if (c.unc) appendUncertainties(c.unc, own);
      }
    }
  }
  fold.eventCount = eventCount;
  return { ok: true, fold, lanes: lanesOfFold(fold, facts) };
}
