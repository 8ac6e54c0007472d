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
  type FlightInput,
  type TaskDefinition,
  type WindowTask,
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

/**
 * Each catalogue variant's maximum in tenths, worked by hand (the same arithmetic as
 * catalogue.test.ts): the slot maxima added up, cut by the F3K.7 sum cap "working time − 1 s
 * per scored flight" where that is lower (E: one target of 599 s beats three of 600 − 3).
 */
const HAND_MAX: Record<string, number> = {
  "A600": 3000, "A420": 3000, "B600": 4800, "B420": 3600, "C3": 5400, "C4": 7200, "C5": 9000,
  "D600": 5980, "E600": 5990, "E900": 8990, "F600": 5400, "G600": 5950, "H600": 5960, "I600": 5970,
  "J600": 5400, "K600": 5950, "L600": 5990, "L420": 4190, "M900": 8970, "N600": 5990,
};
const keyOf = (def: TaskDefinition) => `${def.letter}${def.kind === "all-up" ? def.attempts : def.workingTimeSec}`;

/**
 * A plain reference scorer for the capped window tasks (A, B, D, F, G, I, J, L, N), for flights
 * that all land inside the working time: truncate each to tenths (F3K.7), cap it, keep the
 * flights the task counts (F3K.11), and cut the sum to working time − 1 s per flight that
 * scored (F3K.7). Written apart from the engine, so the engine is checked against it.
 */
function referenceResult(def: WindowTask, durationsMs: readonly number[]): number {
  const allowed = def.launchLimit === null ? durationsMs : durationsMs.slice(0, def.launchLimit);
  const credits = allowed.map((ms) => Math.min(Math.floor(ms / 100), def.capSec! * 10));
  const counted =
    def.counting.rule === "all" ? credits
    : def.counting.rule === "last" ? credits.slice(-def.counting.n)
    : [...credits].sort((a, b) => b - a).slice(0, def.counting.n);
  const sum = counted.reduce((a, b) => a + b, 0);
  const scored = counted.filter((c) => c > 0).length;
  return Math.min(sum, (def.workingTimeSec - scored) * 10);
}
const cappedDefs = windowDefs.filter((d) => d.ladder === null);

/** Flights back to back from the start of working time, every one landed inside it. */
const insideWindow = (def: WindowTask) =>
  fc.array(fc.record({ dur: fc.integer({ min: 0, max: 250_000 }), gap: fc.integer({ min: 0, max: 20_000 }) }), { maxLength: 8 }).map((legs) => {
    const flights: FlightInput[] = [];
    let t = 0;
    for (const l of legs) {
      if (t + l.dur >= def.workingTimeSec * 1000) break;
      flights.push({ launchMs: t, landMs: t + l.dur });
      t += l.dur + l.gap;
    }
    return flights;
  });

describe("properties of the task engine", () => {
  it("the catalogue's maxima are the hand-worked ones (F3K.11, F3K.7)", () => {
    for (const def of allDefs) expect([keyOf(def), maxResultTenths(def)]).toEqual([keyOf(def), HAND_MAX[keyOf(def)]]);
  });

  it("a result never exceeds the task's maximum nor the F3K.7 sum cap", () => {
    fc.assert(
      fc.property(fc.constantFrom(...allDefs), flightsArb, (def, flights) => {
        const lane = foldRun(def, eventsFor(def, flights)).lanes[0]!;
        expect(lane.resultTenths).toBeLessThanOrEqual(HAND_MAX[keyOf(def)]!);
        // F3K.7: working time − 1 s for each flight that scored (task C has its own windows).
        const scored = lane.flights.filter((f) => f.creditedTenths > 0).length;
        if (def.kind !== "all-up") expect(lane.resultTenths).toBeLessThanOrEqual((def.workingTimeSec - scored) * 10);
        expect(Number.isInteger(lane.resultTenths)).toBe(true);
      }),
      { numRuns: 400 },
    );
  });

  it("capped window tasks score what a plain reference scorer gives (F3K.7, F3K.11)", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...cappedDefs).chain((def) => fc.tuple(fc.constant(def), insideWindow(def))),
        ([def, flights]) => {
          const lane = foldRun(def, eventsFor(def, flights)).lanes[0]!;
          expect(lane.resultTenths).toBe(referenceResult(def, flights.map((f) => f.landMs! - f.launchMs)));
        },
      ),
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
        // Against the hand-worked maximum, not the engine's own: the parts explain all of it.
        expect(parts.reduce((x, y) => x + y, 0)).toBe(HAND_MAX[keyOf(def)]! - lane.resultTenths);
        expect(b.lostTenths).toBe(HAND_MAX[keyOf(def)]! - lane.resultTenths);
      }),
      { numRuns: 400 },
    );
  });

  it("for capped window tasks, the points lost add up to the hand maximum less the reference result", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...cappedDefs).chain((def) => fc.tuple(fc.constant(def), insideWindow(def))),
        ([def, flights]) => {
          const b = pointsLost(def, foldRun(def, eventsFor(def, flights)).lanes[0]!);
          const expected = HAND_MAX[keyOf(def)]! - referenceResult(def, flights.map((f) => f.landMs! - f.launchMs));
          expect(b.lostTenths).toBe(expected);
          expect(Object.values(b.parts).reduce((x, y) => x + y, 0)).toBe(expected);
        },
      ),
      { numRuns: 300 },
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
