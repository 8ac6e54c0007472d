import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DRIFT_RATE, interpolateOffset, offsetAt, type ClockEstimate } from "@/lib/clock";

const HOUR = 3_600_000;
const before: ClockEstimate = { thetaMs: 200, deltaMs: 40, measuredAtWallMs: 0 };
const after: ClockEstimate = { thetaMs: 254, deltaMs: 20, measuredAtWallMs: 2 * HOUR };

describe("interpolateOffset", () => {
  it("is linear in device wall time between the two measurements", () => {
    expect(interpolateOffset(before, after, HOUR).thetaMs).toBe(227); // halfway: (200 + 254)/2
    expect(interpolateOffset(before, after, HOUR / 2).thetaMs).toBe(213.5); // a quarter: 200 + 54/4
  });

  it("holds the nearest estimate outside them, the bound growing at 15 ppm", () => {
    // one hour before `before`: δ/2 + 15e-6 × 3 600 000 = 20 + 54 = 74
    const early = interpolateOffset(before, after, -HOUR);
    expect(early.thetaMs).toBe(200);
    expect(early.uncertaintyMs).toBeCloseTo(74, 9);
    // one hour after `after`: 10 + 54 = 64
    const late = interpolateOffset(before, after, 3 * HOUR);
    expect(late.thetaMs).toBe(254);
    expect(late.uncertaintyMs).toBeCloseTo(64, 9);
  });

  it("accepts the two estimates in either order", () => {
    expect(interpolateOffset(after, before, HOUR)).toEqual(interpolateOffset(before, after, HOUR));
  });

  it("between them, never claims more certainty than the truth allows", () => {
    // The true offset starts inside `before`'s bound and drifts at up to 15 ppm, piecewise;
    // `after` is then measured with an honest bound. The interpolated θ ± bound must contain it.
    fc.assert(
      fc.property(
        fc.integer({ min: -600_000, max: 600_000 }),
        fc.array(fc.double({ min: -DRIFT_RATE, max: DRIFT_RATE, noNaN: true }), { minLength: 1, maxLength: 6 }),
        fc.integer({ min: 1, max: 24 * HOUR }),
        fc.double({ min: -1, max: 1, noNaN: true }),
        fc.double({ min: -1, max: 1, noNaN: true }),
        fc.integer({ min: 0, max: 300 }),
        fc.integer({ min: 0, max: 300 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (theta0, rates, span, err1, err2, d1, d2, at) => {
          const trueAt = (t: number) => {
            // piecewise-constant drift over equal segments of the span
            const seg = span / rates.length;
            let theta = theta0;
            for (let i = 0; i < rates.length; i++) theta += rates[i]! * Math.max(0, Math.min(seg, t - i * seg));
            return theta;
          };
          const b: ClockEstimate = { thetaMs: theta0 + (err1 * d1) / 2, deltaMs: d1, measuredAtWallMs: 0 };
          const a: ClockEstimate = { thetaMs: trueAt(span) + (err2 * d2) / 2, deltaMs: d2, measuredAtWallMs: span };
          const t = at * span;
          const got = interpolateOffset(b, a, t);
          expect(Math.abs(got.thetaMs - trueAt(t))).toBeLessThanOrEqual(got.uncertaintyMs + 1e-6);
        },
      ),
      { numRuns: 500 },
    );
  });

  it("covers both estimates when they cannot both hold (the clock was stepped meanwhile)", () => {
    // a 5 s step during a 1 h gap: far beyond 10 + 20 + 54 ms of combined bounds
    const stepped: ClockEstimate = { thetaMs: 5200, deltaMs: 20, measuredAtWallMs: HOUR };
    const mid = interpolateOffset(before, stepped, HOUR / 2);
    expect(mid.thetaMs).toBe(2700);
    expect(mid.thetaMs - mid.uncertaintyMs).toBeLessThanOrEqual(200 - 20);
    expect(mid.thetaMs + mid.uncertaintyMs).toBeGreaterThanOrEqual(5200 + 10);
  });
});

describe("offsetAt", () => {
  it("picks the nearest estimates on each side from an unordered list", () => {
    const far: ClockEstimate = { thetaMs: 999, deltaMs: 2, measuredAtWallMs: -10 * HOUR };
    expect(offsetAt([after, far, before], HOUR)).toEqual(interpolateOffset(before, after, HOUR));
  });

  it("holds the only side there is, and is null without estimates", () => {
    expect(offsetAt([before], HOUR)?.thetaMs).toBe(200);
    expect(offsetAt([after], HOUR)?.thetaMs).toBe(254);
    expect(offsetAt([], HOUR)).toBeNull();
  });
});
