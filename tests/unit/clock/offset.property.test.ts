import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { estimateOffset, sampleDelay, sampleOffset, type TimeSample } from "@/lib/clock";

// Simulated exchanges: device clock = true time, server clock = true time + skew.
// out/back are the one-way path times, proc the server's processing time (integer ms, so
// every θ is an exact half-integer in double precision).
function exchange(t1: number, skew: number, out: number, proc: number, back: number): TimeSample {
  const t2 = t1 + out + skew;
  const t3 = t2 + proc;
  return { t1, t2, t3, t4: t1 + out + proc + back };
}

const epoch = fc.integer({ min: 1_600_000_000_000, max: 2_000_000_000_000 });
const smallSkew = fc.integer({ min: -300, max: 300 });
const largeSkew = fc.integer({ min: -600_000, max: 600_000 });
const skews = fc.oneof(smallSkew, largeSkew, fc.constantFrom(-600_000, -300, 300, 600_000));

describe("offset recovery with symmetric paths (SYNC.md §5: within 5 ms of ±300 ms and ±10 min skews)", () => {
  it("recovers the injected skew within 5 ms on a loopback-like path (legs differ by ≤ 10 ms)", () => {
    const leg = fc.record({ base: fc.integer({ min: 0, max: 50 }), jitter: fc.integer({ min: 0, max: 10 }), proc: fc.integer({ min: 0, max: 20 }), flip: fc.boolean() });
    fc.assert(
      fc.property(epoch, skews, fc.array(leg, { minLength: 1, maxLength: 12 }), (t0, skew, legs) => {
        const samples = legs.map((l, i) => {
          const [out, back] = l.flip ? [l.base + l.jitter, l.base] : [l.base, l.base + l.jitter];
          return exchange(t0 + i * 1000, skew, out, l.proc, back);
        });
        expect(Math.abs(estimateOffset(samples).offsetMs - skew)).toBeLessThanOrEqual(5);
      }),
      { numRuns: 500 },
    );
  });

  it("recovers the skew exactly when both legs are equal", () => {
    fc.assert(
      fc.property(epoch, skews, fc.integer({ min: 0, max: 500 }), fc.integer({ min: 0, max: 50 }), (t0, skew, leg, proc) => {
        expect(estimateOffset([exchange(t0, skew, leg, proc, leg)]).offsetMs).toBe(skew);
      }),
      { numRuns: 300 },
    );
  });
});

describe("asymmetry bound (SYNC.md §5: ±δ/2 never violated with 40/120 ms asymmetry)", () => {
  it("|θ − skew| ≤ δ/2 for every sample and for the estimate", () => {
    const asym = fc.constantFrom(40, 120, -40, -120);
    const leg = fc.record({ base: fc.integer({ min: 0, max: 200 }), asym, proc: fc.integer({ min: 0, max: 30 }) });
    fc.assert(
      fc.property(epoch, skews, fc.array(leg, { minLength: 1, maxLength: 12 }), (t0, skew, legs) => {
        const samples = legs.map((l, i) => {
          // one leg is `asym` ms slower than the other
          const out = l.asym > 0 ? l.base + l.asym : l.base;
          const back = l.asym > 0 ? l.base : l.base - l.asym;
          return exchange(t0 + i * 1000, skew, out, l.proc, back);
        });
        for (const s of samples) {
          expect(Math.abs(sampleOffset(s) - skew)).toBeLessThanOrEqual(sampleDelay(s) / 2);
        }
        const est = estimateOffset(samples);
        expect(Math.abs(est.offsetMs - skew)).toBeLessThanOrEqual(est.boundMs);
        // with 40/120 ms asymmetry the error is exactly half of it: the bound is needed, not slack
        expect(Math.abs(est.offsetMs - skew)).toBeGreaterThanOrEqual(20);
      }),
      { numRuns: 500 },
    );
  });
});

describe("min-δ selection", () => {
  it("chooses a sample with the smallest delay among the last 8, the latest on ties", () => {
    const leg = fc.record({ out: fc.integer({ min: 0, max: 300 }), back: fc.integer({ min: 0, max: 300 }), proc: fc.integer({ min: 0, max: 30 }) });
    fc.assert(
      fc.property(epoch, skews, fc.array(leg, { minLength: 1, maxLength: 20 }), (t0, skew, legs) => {
        const samples = legs.map((l, i) => exchange(t0 + i * 1000, skew, l.out, l.proc, l.back));
        const window = samples.slice(-8);
        const minDelay = Math.min(...window.map(sampleDelay));
        const lastMin = window.filter((s) => sampleDelay(s) === minDelay).at(-1)!;
        expect(estimateOffset(samples)).toEqual({ offsetMs: sampleOffset(lastMin), delayMs: minDelay, boundMs: minDelay / 2 });
      }),
      { numRuns: 500 },
    );
  });
});
