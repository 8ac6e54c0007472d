import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { divideRounded, normaliseGroup, scoreRound } from "@/lib/scoring";

describe("normaliseGroup (F3K.9.1, F3K.10)", () => {
  it("best = 1000, others in proportion to 0.1 point", () => {
    // 300/599.9 × 1000 = 500.083… → 500.1; 421.3/599.9 × 1000 = 702.283… → 702.3
    expect(normaliseGroup([599.9, 300, 421.3, 0])).toEqual([1000, 500.1, 702.3, 0]);
  });
  it("everyone zero → everyone zero", () => {
    expect(normaliseGroup([0, 0])).toEqual([0, 0]);
  });
  it("exact halves round up by default (our choice; the rules do not say)", () => {
    // 1/16 × 1000 = 62.5 exactly → 62.5; 1/32 × 1000 = 31.25 → 31.3 (half-up) / 31.2 (half-even).
    expect(normaliseGroup([32, 1])).toEqual([1000, 31.3]);
    expect(normaliseGroup([32, 1], { halves: "half-even" })).toEqual([1000, 31.2]);
    expect(normaliseGroup([32, 1], { halves: "down" })).toEqual([1000, 31.2]);
    // 3/32 × 1000 = 93.75 → half-even keeps 93.8 (8 is even).
    expect(normaliseGroup([32, 3], { halves: "half-even" })).toEqual([1000, 93.8]);
  });
  it("agrees with exact rational arithmetic (BigInt reference) on tenths of a second", () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 9000 }), { minLength: 1, maxLength: 12 }), (tenths) => {
        const best = BigInt(Math.max(...tenths));
        const expected = tenths.map((t) => {
          if (best === 0n) return 0;
          // round(t / best × 10000) with halves up, in BigInt
          const num = BigInt(t) * 20000n + best;
          return Number(num / (2n * best)) / 10;
        });
        expect(normaliseGroup(tenths.map((t) => t / 10))).toEqual(expected);
      }),
      { numRuns: 500 },
    );
  });
  it("divideRounded: plain integer rounding", () => {
    expect(divideRounded(7, 2, "half-up")).toBe(4);
    expect(divideRounded(5, 2, "half-even")).toBe(2);
    expect(divideRounded(9, 4, "half-up")).toBe(2);
  });
});

describe("scoreRound", () => {
  it("normalises each group on its own best", () => {
    const points = scoreRound([
      [{ pilotId: "p1", resultTenths: 1300 }, { pilotId: "p2", resultTenths: 1600 }],
      [{ pilotId: "p3", resultTenths: 1500 }],
    ]);
    expect(Object.fromEntries(points)).toEqual({ p1: 8125, p2: 10000, p3: 10000 });
  });
});
