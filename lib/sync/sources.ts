import type { EventKind } from "@/lib/events/schema";
import type { TimelineEvent } from "@/lib/tasks";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";
import type { DerivationEvent, Source } from "./types";

/**
 * The conflict rules of SYNC.md §3. When several devices recorded the same lane (or gave the
 * run's signals), one device's record is used whole and the others stay as versions:
 *   1. an official timekeeper (a recorder who is not that lane's pilot) over self-timing,
 *   2. then the earlier corrected time of the record's first event,
 *   3. then the device id, as the last tie-break.
 * Records are never merged tap by tap: pairing one phone's launch with another's landing
 * would produce flights nobody timed. Penalties and invalid marks are rulings, not timing: the
 * chosen record's own, plus those an official gave from a phone that timed none of the lane
 * (laneRulings).
 */

/** What makes a lane's timing record. */
const LANE_KINDS: ReadonlySet<EventKind> = new Set(["launch", "landing", "target", "end-call"]);
/** Rulings on a lane: they judge flights, they do not time them. */
const RULING_KINDS: ReadonlySet<EventKind> = new Set(["invalid", "penalty"]);
const SIGNAL_KINDS: ReadonlySet<EventKind> = new Set(["window-start", "run-end"]);

/** Orders candidate sources by the conflict rules (best first). */
export function compareSources(a: Source, b: Source): number {
  if (a.official !== b.official) return a.official ? -1 : 1;
  if (a.firstAtMs !== b.firstAtMs) return a.firstAtMs - b.firstAtMs;
  return a.deviceId < b.deviceId ? -1 : a.deviceId > b.deviceId ? 1 : 0;
}

/** `base` plus every void or correct that names one of them, transitively (undo of an undo). */
export function withAmendments(base: readonly DerivationEvent[], all: readonly DerivationEvent[]): DerivationEvent[] {
  const ids = new Set(base.map((e) => e.id));
  const out = [...base];
  for (let grew = true; grew; ) {
    grew = false;
    for (const e of all) {
      if ((e.body.kind === "void" || e.body.kind === "correct") && !ids.has(e.id) && ids.has(e.body.targetId)) {
        ids.add(e.id);
        out.push(e);
        grew = true;
      }
    }
  }
  return out;
}

const onLane = (e: DerivationEvent, lane: number) => "lane" in e.body && e.body.lane === lane;

function byDevice(events: readonly DerivationEvent[], keep: (e: DerivationEvent) => boolean): Map<string, DerivationEvent[]> {
  const groups = new Map<string, DerivationEvent[]>();
  for (const e of events) {
    if (!keep(e)) continue;
    const list = groups.get(e.deviceId);
    if (list) list.push(e);
    else groups.set(e.deviceId, [e]);
  }
  return groups;
}

type ToTimeline = (e: DerivationEvent) => TimelineEvent;

/**
 * Candidates for the run's signals (window start, run end), best first: devices whose
 * window-start survives their undos. Official = recorded by someone flying no lane of the run.
 */
export function signalSources(events: readonly DerivationEvent[], pilotIds: ReadonlySet<string>, toTimeline: ToTimeline): Source[] {
  const out: Source[] = [];
  for (const [deviceId, base] of byDevice(events, (e) => SIGNAL_KINDS.has(e.body.kind))) {
    const amended = withAmendments(base, events);
    const starts = applyUndoAndCorrections(amended.map(toTimeline)).filter((e) => e.body.kind === "window-start");
    const first = starts[0];
    if (!first) continue;
    const recordedBy = base[0]!.recordedBy;
    out.push({ deviceId, recordedBy, official: !pilotIds.has(recordedBy), firstAtMs: first.atMs, events: amended });
  }
  return out.sort(compareSources);
}

/**
 * Candidates for one lane, best first: devices with at least one lane event that survives
 * their undos. Official = recorded by someone other than the lane's pilot (every recorder of
 * a guest's lane is official).
 */
export function laneSources(
  events: readonly DerivationEvent[],
  lane: number,
  pilotUserId: string | null,
  toTimeline: ToTimeline,
): Source[] {
  const out: Source[] = [];
  const groups = byDevice(events, (e) => LANE_KINDS.has(e.body.kind) && onLane(e, lane));
  for (const [deviceId, base] of groups) {
    const amended = withAmendments(base, events);
    const effective = applyUndoAndCorrections(amended.map(toTimeline));
    if (effective.length === 0) continue;
    const recordedBy = base[0]!.recordedBy;
    out.push({
      deviceId,
      recordedBy,
      official: pilotUserId === null || recordedBy !== pilotUserId,
      firstAtMs: Math.min(...effective.map((e) => e.atMs)),
      events: [...amended, ...withAmendments(rulingsOn(events, lane, (e) => e.deviceId === deviceId), events)],
    });
  }
  return out.sort(compareSources);
}

function rulingsOn(events: readonly DerivationEvent[], lane: number, keep: (e: DerivationEvent) => boolean): DerivationEvent[] {
  return events.filter((e) => RULING_KINDS.has(e.body.kind) && onLane(e, lane) && keep(e));
}

/**
 * Penalties and invalid marks for a lane given by an official (anyone but the lane's pilot)
 * from a phone that timed none of the lane — a field director's phone — with their undos.
 * They apply to whichever timing record is chosen (an invalid mark names the flight by its
 * number in the lane); a phone that also timed the lane keeps its rulings in its own record,
 * so one ruling is never counted twice.
 */
export function laneRulings(
  events: readonly DerivationEvent[],
  lane: number,
  pilotUserId: string | null,
  timingDevices: ReadonlySet<string>,
): DerivationEvent[] {
  const rulings = rulingsOn(events, lane, (e) => !timingDevices.has(e.deviceId) && (pilotUserId === null || e.recordedBy !== pilotUserId));
  return withAmendments(rulings, events);
}
