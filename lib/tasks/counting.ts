import type { WindowTask } from "./definition";
import type { FlightReason, TimedFlight } from "./timing";

/** What the counting rule decided for one flight. */
export type CountDecision = { counted: boolean; slotCapTenths: number | null; creditedTenths: number; reason: FlightReason | null };

/**
 * Applies a window task's counting rule (last n / best n / all) and its caps or ladder.
 *
 * Flights outside the task (`excludedReason`) never count and never displace another.
 * A zero-scoring flight still takes its place: under "last n" an invalid last flight
 * counts as zero (A: a new launch cancels the previous time).
 * Any-order ladders match the longest flight to the longest target, the next to the next
 * (F3K.11.8); that matching is also the one that maximises the result.
 */
export function countWindowFlights(def: WindowTask, flights: readonly TimedFlight[]): CountDecision[] {
  const picks: CountDecision[] = flights.map((f) => ({
    counted: false,
    slotCapTenths: null,
    creditedTenths: 0,
    reason: f.excludedReason,
  }));
  const eligible = flights.filter((f) => f.excludedReason === null);
  const uniformCap = (def.capSec ?? def.workingTimeSec) * 10;
  const targets = def.ladder ? def.ladder.targetsSec.map((t) => t * 10) : null;
  const anyOrder = def.ladder?.order === "any-order";

  let selected: TimedFlight[];
  let notSelected: FlightReason;
  if (def.counting.rule === "all") {
    selected = eligible;
    notSelected = "beyond-ladder";
  } else if (def.counting.rule === "last") {
    selected = eligible.slice(-def.counting.n);
    notSelected = "superseded";
  } else {
    const value = (f: TimedFlight) => (targets ? f.timeTenths : Math.min(f.timeTenths, uniformCap));
    selected = [...eligible]
      .sort((a, b) => value(b) - value(a) || a.index - b.index)
      .slice(0, def.counting.n)
      .sort((a, b) => a.index - b.index);
    notSelected = "not-among-best";
  }

  let slotOf: (f: TimedFlight, position: number) => number | null;
  if (!targets) slotOf = () => uniformCap;
  else if (anyOrder) {
    const byTime = [...selected].sort((a, b) => b.timeTenths - a.timeTenths || a.index - b.index);
    const sortedTargets = [...targets].sort((a, b) => b - a);
    const slot = new Map(byTime.map((f, i) => [f.index, sortedTargets[i] ?? null]));
    slotOf = (f) => slot.get(f.index) ?? null;
  } else slotOf = (_f, position) => targets[position] ?? null;

  const chosen = new Set<number>();
  selected.forEach((f, position) => {
    const cap = slotOf(f, position);
    if (cap === null) return; // more flights than ladder steps
    chosen.add(f.index);
    picks[f.index] = {
      counted: true,
      slotCapTenths: cap,
      creditedTenths: f.zeroReason ? 0 : Math.min(f.timeTenths, cap),
      reason: f.zeroReason,
    };
  });
  for (const f of eligible) {
    if (!chosen.has(f.index)) picks[f.index] = { counted: false, slotCapTenths: null, creditedTenths: 0, reason: f.zeroReason ?? notSelected };
  }
  return picks;
}
