import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CATALOGUE, type TaskDefinition } from "@/lib/tasks";
import { pairFlights } from "@/lib/tasks/flights";
import { scoreLane, type ScoredFlight } from "@/lib/tasks/score";
import { timeAllUpFlights, timeWindowFlights, type TimedFlight } from "@/lib/tasks/timing";
import { eventLog } from "./helpers";

const allDefs: TaskDefinition[] = Object.values(CATALOGUE).flat();

/**
 * scoreLane builds each scored flight by naming every field of the timed flight (a spread that
 * then adds fields gives every object its own hidden class in V8, ~100× slower over a long run).
 * The reference here is the spread it replaced: the same fields, values and order, on random
 * flights, invalid marks and open flights, for every catalogue task and with a live clock.
 */
describe("scoreLane's flights", () => {
  const legs = fc.array(
    fc.record({ dur: fc.integer({ min: 0, max: 400_000 }), gap: fc.integer({ min: 0, max: 120_000 }), land: fc.boolean(), invalid: fc.boolean() }),
    { maxLength: 12 },
  );
  it("carry every field of the timed flight unchanged, in its order, then the counting rule's (reference: the former spread)", () => {
    fc.assert(
      fc.property(fc.constantFrom(...allDefs), legs, fc.integer({ min: -60_000, max: 60_000 }), fc.option(fc.integer({ min: 0, max: 4_000_000 })), (def, list, offset, now) => {
        const log = eventLog();
        if (def.kind === "all-up") for (let k = 0; k < def.attempts; k++) log.start(k * 700_000);
        else log.start(0);
        let t = offset;
        for (const l of list) {
          const launch = log.launch(t);
          if (l.invalid) log.add(t + 1, { kind: "invalid", lane: 0, flightId: launch, reason: "part-lost" });
          t += l.dur;
          if (l.land) log.land(t);
          t += l.gap;
        }
        const run = pairFlights(log.events, 1);
        const lane = run.lanes[0]!;
        const clock = now === null ? null : { nowMs: now };
        const timed: TimedFlight[] =
          def.kind === "all-up" ? timeAllUpFlights(def, run.signalsMs, lane, clock) : timeWindowFlights(def, run.signalsMs[0] ?? null, lane, clock);
        const scored = scoreLane(def, run, lane, clock).flights;
        expect(scored).toHaveLength(timed.length);
        scored.forEach((f: ScoredFlight, i) => {
          const own = Object.fromEntries(Object.keys(timed[i]!).map((k) => [k, f[k as keyof ScoredFlight]]));
          expect(own).toStrictEqual(timed[i]);
          expect(Object.keys(f)).toEqual([...Object.keys(timed[i]!), "status", "reason", "counted", "creditedTenths", "slotCapTenths", "targetSec"]);
        });
      }),
      { numRuns: 300 },
    );
  });
});
