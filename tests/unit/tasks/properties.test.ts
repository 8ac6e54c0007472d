import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  CATALOGUE,
  foldRun,
  liveState,
  maxResultTenths,
  msToTenths,
  pointsLost,
  scoreTask,
  sumCapTenths,
  type FlightInput,
  type TaskDefinition,
} from "@/lib/tasks";
import { eventLog } from "./helpers";

const allDefs: TaskDefinition[] = Object.values(CATALOGUE).flat();
const windowDefs = allDefs.filter((d) => d.kind === "window");

const flightsArb = fc
  .record({
    offset: fc.integer({ min: -5000, max: 5000 }),
    legs: fc.array(fc.record({ dur: fc.integer({ min: 0, max: 400_000 }), gap: fc.integer({ min: 0, max: 30_000 }), target: fc.integer({ min: 1, max: 300 }) }), { maxLength: 9 }),
  })
  .map(({ offset, legs }) => {
    let t = offset;
    return legs.map((l): FlightInput => {
      const f = { launchMs: t, landMs: t + l.dur, targetSec: l.target };
      t = f.landMs + l.gap;
      return f;
    });
  });

const eventsFor = (def: TaskDefinition, flights: readonly FlightInput[]) => {
  const log = eventLog();
  if (def.kind === "all-up") for (let k = 0; k < def.attempts; k++) log.start(k * 1_000_000);
  else log.start(0);
  flights.forEach((f, i) => {
    const base = def.kind === "all-up" ? i * 1_000_000 : 0;
    if (def.kind === "poker" && f.targetSec) log.add(base + f.launchMs, { kind: "target", lane: 0, targetSec: f.targetSec });
    log.launch(base + f.launchMs);
    if (f.landMs !== null) log.land(base + f.landMs);
  });
  return log.events;
};

describe("properties of the task engine", () => {
  it("a result never exceeds the task's maximum nor the F3K.7 sum cap", () => {
    fc.assert(
      fc.property(fc.constantFrom(...allDefs), flightsArb, (def, flights) => {
        const lane = foldRun(def, eventsFor(def, flights)).lanes[0]!;
        expect(lane.resultTenths).toBeLessThanOrEqual(maxResultTenths(def));
        const scored = lane.flights.filter((f) => f.creditedTenths > 0).length;
        const cap = sumCapTenths(def, scored);
        if (cap !== null) expect(lane.resultTenths).toBeLessThanOrEqual(cap);
        expect(Number.isInteger(lane.resultTenths)).toBe(true);
      }),
      { numRuns: 400 },
    );
  });

  it("any-order tasks score the same whatever the order of the flights (G, H, I, N)", () => {
    const anyOrder = windowDefs.filter((d) => d.counting.rule === "best" && d.launchLimit === null);
    fc.assert(
      fc.property(
        fc.constantFrom(...anyOrder),
        fc.array(fc.integer({ min: 0, max: 120_000 }), { maxLength: 5 }),
        fc.infiniteStream(fc.nat()),
        (def, durations, stream) => {
          // ≤ 5 flights of ≤ 120 s with 1 s gaps always land inside 10 minutes.
          const shuffled = [...durations];
          for (let i = shuffled.length - 1; i > 0; i--) {
            const j = stream.next().value % (i + 1);
            [shuffled[i], shuffled[j]] = [shuffled[j]!, shuffled[i]!];
          }
          const lay = (ds: number[]) => {
            let t = 0;
            return ds.map((d) => {
              const f = { launchMs: t, landMs: t + d };
              t += d + 1000;
              return f;
            });
          };
          const a = scoreTask({ task: def, flights: lay(durations) }).tenths;
          const b = scoreTask({ task: def, flights: lay(shuffled) }).tenths;
          expect(b).toBe(a);
        },
      ),
      { numRuns: 300 },
    );
  });

  it("truncation never rounds up (F3K.7)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 3_600_000 }), fc.double({ min: 0, max: 0.999, noNaN: true }), (ms, noise) => {
        const tenths = msToTenths(ms + noise);
        expect(tenths * 100).toBeLessThanOrEqual(ms + noise);
        expect((tenths + 1) * 100).toBeGreaterThan(ms + noise);
      }),
    );
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 598_999 }), (durMs) => {
        const r = scoreTask({ task: "N", flights: [{ launchMs: 0, landMs: durMs }] });
        expect(r.tenths * 100).toBeLessThanOrEqual(durMs);
        expect(r.seconds).toBe(r.tenths / 10);
      }),
    );
  });

  it("the points-lost parts are never negative and add up exactly to max − result", () => {
    fc.assert(
      fc.property(fc.constantFrom(...allDefs), flightsArb, fc.array(fc.nat({ max: 8 }), { maxLength: 2 }), (def, flights, invalid) => {
        const events = eventsFor(def, flights);
        const log = eventLog();
        for (const i of invalid) log.add(10_000_000, { kind: "invalid", lane: 0, flightIndex: i, reason: "other" });
        const lane = foldRun(def, [...events, ...log.events.map((e, k) => ({ ...e, id: `ffffffff-0000-7000-8000-${String(k).padStart(12, "0")}` }))]).lanes[0]!;
        const b = pointsLost(def, lane);
        const parts = Object.values(b.parts);
        for (const p of parts) expect(p).toBeGreaterThanOrEqual(0);
        expect(parts.reduce((x, y) => x + y, 0)).toBe(b.lostTenths);
        expect(b.lostTenths).toBe(maxResultTenths(def) - lane.resultTenths);
      }),
      { numRuns: 400 },
    );
  });

  it("the best still possible at any moment is never below the final result (every task)", () => {
    fc.assert(
      fc.property(fc.constantFrom(...allDefs), flightsArb, fc.integer({ min: 0, max: 3_000_000 }), (def, flights, nowMs) => {
        const all = eventsFor(def, flights);
        const final = foldRun(def, all).lanes[0]!.resultTenths;
        const sofar = all.filter((e) => e.atMs <= nowMs);
        const best = liveState(def, sofar, nowMs, { laneCount: 1 }).lanes[0]!.bestPossibleTenths;
        expect(best).toBeGreaterThanOrEqual(final);
      }),
      { numRuns: 500 },
    );
  });
});
