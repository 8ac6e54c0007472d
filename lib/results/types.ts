import type { PenaltyCause, ReflightCause, ReflightPlacement } from "@/lib/events/schema";
import type { ClockEstimate } from "@/lib/clock";
import type { PointsLost, TaskDefinition } from "@/lib/tasks";
import type { PlacedEvent, RecordedEvent } from "./place";

/**
 * Types of the server-side derivation (SYNC.md §1, §3): a run's stored events from every
 * device → one official result per lane, every device's version kept beside it.
 */

/** One event with its place on the run's timeline (lib/results/place.ts). */
export type DerivationEvent = PlacedEvent<RecordedEvent>;

export type DerivationInput = {
  task: TaskDefinition;
  /** Who created the run (its timekeeper at the field): their signals go before a lane pilot's own. */
  createdBy: string;
  lanes: readonly { lane: number; pilotUserId: string | null }[];
  /**
   * Users a contest assigned to time this run: only their records are official. Empty until
   * contests assign timekeepers (db/schema/contests.ts has no such assignment yet).
   */
  officials: ReadonlySet<string>;
  /** Every event of the run, from every device (placed on the timeline by lib/results/place.ts). */
  events: readonly RecordedEvent[];
  /** Each device's clock estimates (server: all it stored; a phone: what it knows). */
  estimatesByDevice: ReadonlyMap<string, readonly ClockEstimate[]>;
  /**
   * A record chosen by hand for a lane, in place of the conflict rules' pick (lib/results/sources.ts):
   * lane → the device whose record stands. Ignored for a lane that device did not record. Only a club
   * day's board passes it (an officer's decision, db/queries/club-day-board.ts); the stored derivation
   * (run_lanes, run_folds) and the phones never do.
   */
  standing?: ReadonlyMap<number, string>;
};

/** One device's record of a lane (or of the run's signals), as a candidate in the conflict rules. */
export type Source = {
  deviceId: string;
  recordedBy: string;
  /** Recorded by a timekeeper a contest assigned to the run (DerivationInput.officials). */
  official: boolean;
  /** Recorded by the lane's own pilot (for signals: by the run's creator). */
  own: boolean;
  /** Corrected time of its first event in question. */
  firstAtMs: number;
  /** The events it contributes, with the voids and corrections that name them. */
  events: DerivationEvent[];
};

/** A flight as the run page draws it (times relative to working-time start; corrected clock). */
export type DerivedFlight = {
  index: number;
  /** From the start of working time (task C: from its attempt's signal), as the strip draws it. */
  launchMs: number;
  landMs: number | null;
  /** The same instants on the run's corrected clock (epoch ms): what logs and model choices are matched to. */
  launchAtMs: number;
  landAtMs: number | null;
  status: string;
  reason: string | null;
  timeTenths: number;
  creditedTenths: number;
  targetSec: number | null;
};

/** One device's version of a lane: what it says, on the corrected clock. */
export type LaneVersion = {
  deviceId: string;
  recordedBy: string;
  official: boolean;
  chosen: boolean;
  resultTenths: number;
  firstAtMs: number;
  /** Largest uncertainty among its events (null = unbounded: no clock measurement). */
  uncertaintyMs: number | null;
  eventCount: number;
  flights: { launchAtMs: number; landAtMs: number | null }[];
};

/**
 * A ruling that does not count — a penalty, an invalid mark, "not signed" or a re-flight — given
 * by someone who is neither an official nor the lane's pilot (a partner at practice), or by the
 * pilot from a phone that did not time the lane. Shown beside the result so the pilot sees it
 * before accepting the run, and the one who gave it sees it was not applied.
 */
export type RulingNote = {
  eventId: string;
  deviceId: string;
  recordedBy: string;
  kind: "penalty" | "invalid" | "unsigned" | "reflight";
  /** A re-flight's grounds and where it would be flown (kind "reflight" only). */
  reflight?: { cause: ReflightCause; placement: ReflightPlacement };
  points: number | null;
  /** The flight's number in the lane (0-based) in the result, when it names one. */
  flightIndex: number | null;
  /** The launch event id of the flight it names (absent on marks recorded by position). */
  flightId?: string | null;
  reason: string;
};

/** A launch or landing the clocks cannot place on one side of a boundary. */
export type ReviewItem = { eventId: string; boundary: string; atMs: number; boundaryMs: number; marginMs: number | null };

/**
 * A wall-clock step inside the lane's record: the steady (monotonic) time is used, the wall
 * time is shown beside it. `flightIndex` when both events are one flight's launch and landing.
 */
export type ClockFlag = { deviceId: string; flightIndex: number | null; monoTenths: number; wallTenths: number };

/** One penalty of a lane as derived: its event, size, cause and reason, and whether it counts (and why not). */
export type DerivedPenalty = {
  eventId: string; points: number; cause: PenaltyCause | null; reason: string; applied: boolean; dropped: "mid-air-collision" | "higher-in-same-attempt" | null;
};

/** What run_lanes.derived holds (JSON: no Infinity, unbounded is null). */
export type LaneDerived = {
  signal: { deviceId: string; official: boolean; atMs: number[]; uncertaintyMs: number | null } | null;
  source: { deviceId: string; official: boolean } | null;
  flights: DerivedFlight[];
  breakdown: PointsLost | null;
  versions: LaneVersion[];
  review: ReviewItem[];
  /** Where the phone that timed the lane saw its wall clock jump against its steady clock (absent before this check existed). */
  clock?: ClockFlag[];
  /** Rulings recorded for the lane that do not count (absent in results derived before notes existed). */
  notes?: RulingNote[];
  /**
   * The counting record's penalties (`penalty` events, voids applied) with the verdict of the penalty
   * rules (lib/tasks/penalty-rules.ts: F3K.4.3 highest per attempt, none for a mid-air collision);
   * `eventId` names the event (who gave it and when). Absent in results derived before this existed.
   */
  penalties?: DerivedPenalty[];
  ended: boolean;
};

export type LaneDerivation = {
  lane: number;
  /** null when no device recorded anything for this lane. */
  resultTenths: number | null;
  penaltyPoints: number;
  needsReview: boolean;
  reviewReason: string | null;
  derived: LaneDerived;
};
