import type { TaskDefinition } from "./definition";
import { countWindowFlights, type CountDecision } from "./counting";
import type { LaneLog, RunLog } from "./flights";
import { countPokerFlights, type PokerState } from "./poker";
import { sumCapTenths } from "./limits";
import { applyPenaltyRules, type PenaltyVerdict } from "./penalty-rules";
import { timeAllUpFlights, timeWindowFlights, type Clock, type FlightReason, type TimedFlight } from "./timing";

export type FlightStatus = "counted" | "capped" | "not-counted" | "invalid" | "open";

/** One flight as the timer and the logbook show it (times relative to working-time start). */
export type ScoredFlight = TimedFlight & {
  status: FlightStatus;
  reason: FlightReason | null;
  /** Counts toward the result (its credit may still be 0 if it is invalid). */
  counted: boolean;
  /** What this flight adds to the result, in tenths (before the sum cap). */
  creditedTenths: number;
  /** The cap or target of the slot this flight fills, in tenths. */
  slotCapTenths: number | null;
  /** Task E / called targets: the target this flight attempted. */
  targetSec: number | null;
};

export type LaneScore = {
  lane: number;
  flights: ScoredFlight[];
  /** Sum of credited tenths before the F3K.7 sum cap. */
  rawTenths: number;
  /** The sum cap that applied (tenths), or null for tasks without one. */
  sumCapTenths: number | null;
  /** The task result in tenths of a second (0 when the round is zeroed). */
  resultTenths: number;
  /** Penalty points that apply (penalty-rules.ts: highest per attempt, none for mid-air). */
  penaltyPoints: number;
  /** Every penalty recorded on the lane, applied or dropped, with the reason. */
  penalties: PenaltyVerdict[];
  /** Why the round scores zero (F3K.4.1 contact at launch, F3K.1.2 not signed), or null. */
  roundZero: "launch-contact" | "unsigned" | null;
  /** The result the round-zero ruling took away, in tenths (0 when none). */
  zeroedTenths: number;
  /** Re-flights granted to the lane's pilot (F3K.9.6), in the order recorded. */
  reflights: LaneLog["reflights"];
  poker: PokerState | null;
};

/** Scores one lane: timing rules, then the counting rule, then the sum cap (F3K.7). */
export function scoreLane(def: TaskDefinition, run: RunLog, log: LaneLog, clock: Clock): LaneScore {
  let timed: TimedFlight[];
  let picks: CountDecision[];
  let targetOf: (number | null)[] = [];
  let poker: PokerState | null = null;
  if (def.kind === "all-up") {
    timed = timeAllUpFlights(def, run.signalsMs, log, clock);
    picks = timed.map((f) => {
      if (f.excludedReason) return { counted: false, slotCapTenths: null, creditedTenths: 0, reason: f.excludedReason };
      const cap = def.capSec * 10;
      return { counted: true, slotCapTenths: cap, creditedTenths: f.zeroReason ? 0 : Math.min(f.timeTenths, cap), reason: f.zeroReason };
    });
  } else {
    timed = timeWindowFlights(def, run.signalsMs[0] ?? null, log, clock);
    if (def.kind === "window") picks = countWindowFlights(def, timed);
    else {
      const result = countPokerFlights(def, timed, log.calls);
      picks = result.picks;
      targetOf = result.targetOf;
      poker = result.state;
    }
  }

  let rawTenths = 0;
  let scored = 0;
  const flights = timed.map((f, i): ScoredFlight => {
    const pick = picks[i]!;
    rawTenths += pick.creditedTenths;
    if (pick.creditedTenths > 0) scored += 1;
    // every field named, not `...f`: a spread that then adds six fields gives each flight a hidden
    // class of its own in V8 (~100× slower to build and to JSON.stringify; a long run has thousands)
    return {
      index: f.index, launchId: f.launchId, launchAtMs: f.launchAtMs, landAtMs: f.landAtMs, launchMs: f.launchMs, landMs: f.landMs,
      attempt: f.attempt, open: f.open, airTenths: f.airTenths, timeTenths: f.timeTenths, inWindowTenths: f.inWindowTenths,
      zeroReason: f.zeroReason, excludedReason: f.excludedReason, markedInvalid: f.markedInvalid,
      status: statusOf(f, pick),
      reason: pick.reason,
      counted: pick.counted,
      creditedTenths: pick.creditedTenths,
      slotCapTenths: pick.slotCapTenths,
      targetSec: targetOf[i] ?? (def.kind === "window" && def.ladder && pick.slotCapTenths !== null ? pick.slotCapTenths / 10 : null),
    };
  });
  // "Scored flights" for F3K.7 = flights that add time to the result (choice: a counted
  // zero does not cost its one second).
  const cap = sumCapTenths(def, scored);
  const flown = cap === null ? rawTenths : Math.min(rawTenths, cap);
  const penalties = applyPenaltyRules(log.penalties);
  const roundZero = penalties.zeroesRound ? "launch-contact" : log.unsigned.length > 0 ? "unsigned" : null;
  return {
    lane: log.lane,
    flights,
    rawTenths,
    sumCapTenths: cap,
    resultTenths: roundZero ? 0 : flown,
    penaltyPoints: penalties.points,
    penalties: penalties.verdicts,
    roundZero,
    zeroedTenths: roundZero ? flown : 0,
    reflights: log.reflights,
    poker,
  };
}

function statusOf(f: TimedFlight, pick: CountDecision): FlightStatus {
  if (f.open) return "open";
  if (f.zeroReason && !f.excludedReason) return "invalid";
  if (!pick.counted) return "not-counted";
  return pick.slotCapTenths !== null && f.timeTenths > pick.slotCapTenths ? "capped" : "counted";
}
