import type { EventKind } from "@/lib/events/schema";
import type { TimelineEvent } from "@/lib/tasks";
import { applyUndoAndCorrections } from "@/lib/tasks/timeline";
import type { DerivationEvent, RulingNote, Source } from "./types";

/**
 * The conflict rules of SYNC.md §3. When several devices recorded the same lane (or gave the
 * run's signals), one device's record is used whole and the others stay as versions:
 *   1. an official record: one made by a timekeeper a contest assigned to the run. Nobody else
 *      is official — a partner or a club mate holding the watch is a recorder like any other;
 *   2. then the lane pilot's own record (for the run's signals: the run creator's, who set the
 *      window up): a club mate's record never displaces what the pilot timed themselves;
 *   3. then the earlier corrected time of the record's first event;
 *   4. then the device id, as the last tie-break.
 * Records are never merged tap by tap: pairing one phone's launch with another's landing
 * would produce flights nobody timed. Penalties and invalid marks are rulings, not timing, and
 * only an official or the pilot themselves can make one: an official's from any phone
 * (laneRulings), the pilot's own in the record they timed. A ruling anyone else recorded is
 * kept as a note (rulingNotes) and never changes the result.
 */

/** What makes a lane's timing record. */
const LANE_KINDS: ReadonlySet<EventKind> = new Set(["launch", "landing", "target", "end-call"]);
/** Rulings on a lane: they judge flights, they do not time them. */
const RULING_KINDS: ReadonlySet<EventKind> = new Set(["invalid", "penalty", "unsigned", "reflight"]);
const SIGNAL_KINDS: ReadonlySet<EventKind> = new Set(["window-start", "run-end"]);

/** Orders candidate sources by the conflict rules (best first). */
export function compareSources(a: Source, b: Source): number {
  if (a.official !== b.official) return a.official ? -1 : 1;
  if (a.own !== b.own) return a.own ? -1 : 1;
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

/** Who counts as what for one run: the contest's assigned timekeepers and the run's creator. */
export type RunRoles = { officials: ReadonlySet<string>; createdBy: string };

/**
 * Candidates for the run's signals (window start, run end), best first: devices whose
 * window-start survives their undos. Official = an assigned timekeeper; own = the run's creator.
 */
export function signalSources(events: readonly DerivationEvent[], roles: RunRoles, toTimeline: ToTimeline): Source[] {
  const out: Source[] = [];
  for (const [deviceId, base] of byDevice(events, (e) => SIGNAL_KINDS.has(e.body.kind))) {
    const amended = withAmendments(base, events);
    const starts = applyUndoAndCorrections(amended.map(toTimeline)).filter((e) => e.body.kind === "window-start");
    const first = starts[0];
    if (!first) continue;
    const recordedBy = base[0]!.recordedBy;
    out.push({
      deviceId, recordedBy, official: roles.officials.has(recordedBy), own: recordedBy === roles.createdBy, firstAtMs: first.atMs, events: amended,
    });
  }
  return out.sort(compareSources);
}

/**
 * Candidates for one lane, best first: devices with at least one lane event that survives
 * their undos. Official = an assigned timekeeper; own = the lane's pilot (a guest's lane has no
 * own record). A record carries its device's rulings on the lane only when it is official, the
 * pilot's own, or (a guest's lane) the run's creator's: a partner's penalty on a member's lane is a
 * note, not part of what they timed.
 */
export function laneSources(
  events: readonly DerivationEvent[],
  lane: number,
  pilotUserId: string | null,
  roles: RunRoles,
  toTimeline: ToTimeline,
): Source[] {
  const out: Source[] = [];
  const groups = byDevice(events, (e) => LANE_KINDS.has(e.body.kind) && onLane(e, lane));
  for (const [deviceId, base] of groups) {
    const amended = withAmendments(base, events);
    const effective = applyUndoAndCorrections(amended.map(toTimeline));
    if (effective.length === 0) continue;
    const recordedBy = base[0]!.recordedBy;
    const official = roles.officials.has(recordedBy);
    const own = pilotUserId !== null && recordedBy === pilotUserId;
    // A guest's lane (no account) has no pilot to accept or dispute: the run's creator rules on it.
    const rules = official || own || (pilotUserId === null && recordedBy === roles.createdBy);
    const rulings = rules ? withAmendments(rulingsOn(events, lane, (e) => e.deviceId === deviceId && e.recordedBy === recordedBy), events) : [];
    out.push({ deviceId, recordedBy, official, own, firstAtMs: Math.min(...effective.map((e) => e.atMs)), events: [...amended, ...rulings] });
  }
  return out.sort(compareSources);
}

function rulingsOn(events: readonly DerivationEvent[], lane: number, keep: (e: DerivationEvent) => boolean): DerivationEvent[] {
  return events.filter((e) => RULING_KINDS.has(e.body.kind) && onLane(e, lane) && keep(e));
}

/**
 * Penalties and invalid marks for a lane given by an official (an assigned timekeeper) from a
 * phone that timed none of the lane — a field director's phone — with their undos. They apply
 * to whichever timing record is chosen (an invalid mark names the flight by its launch event's id); a phone that also timed the lane keeps its rulings in its own record, so one ruling is
 * never counted twice.
 */
export function laneRulings(
  events: readonly DerivationEvent[],
  lane: number,
  officials: ReadonlySet<string>,
  timingDevices: ReadonlySet<string>,
): DerivationEvent[] {
  const rulings = rulingsOn(events, lane, (e) => !timingDevices.has(e.deviceId) && officials.has(e.recordedBy));
  return withAmendments(rulings, events);
}

/**
 * The lane's rulings that stand (not undone) but do not count: every one not among `applied`
 * (the events the chosen record and the officials' rulings contributed). Kept as notes so the
 * pilot sees a partner's penalty before accepting the run, and the partner sees it was not applied.
 */
export function rulingNotes(
  events: readonly DerivationEvent[],
  lane: number,
  applied: ReadonlySet<string>,
  toTimeline: ToTimeline,
): RulingNote[] {
  const byId = new Map(events.map((e) => [e.id, e]));
  const standing = applyUndoAndCorrections(withAmendments(rulingsOn(events, lane, () => true), events).map(toTimeline));
  const out: RulingNote[] = [];
  for (const t of standing) {
    const e = byId.get(t.id);
    if (!e || applied.has(e.id)) continue;
    if (e.body.kind === "penalty") {
      out.push({ eventId: e.id, deviceId: e.deviceId, recordedBy: e.recordedBy, kind: "penalty", points: e.body.points, flightIndex: null, flightId: e.body.launchId ?? null, reason: e.body.reason });
    } else if (e.body.kind === "invalid") {
      out.push({ eventId: e.id, deviceId: e.deviceId, recordedBy: e.recordedBy, kind: "invalid", points: null, flightIndex: e.body.flightIndex ?? null, flightId: e.body.flightId ?? null, reason: e.body.reason });
    } else if (e.body.kind === "unsigned") {
      out.push({ eventId: e.id, deviceId: e.deviceId, recordedBy: e.recordedBy, kind: "unsigned", points: null, flightIndex: null, reason: "" });
    } else if (e.body.kind === "reflight") {
      const { cause, placement, reason } = e.body;
      out.push({ eventId: e.id, deviceId: e.deviceId, recordedBy: e.recordedBy, kind: "reflight", points: null, flightIndex: null, reflight: { cause, placement }, reason: reason ?? "" });
    }
  }
  return out;
}
