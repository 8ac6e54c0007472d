import { describe, expect, it } from "vitest";
import { affectedWallRange, correctStamp } from "@/lib/sync/correct-events";

const est = (measuredAtWallMs: number, thetaMs: number, deltaMs = 20) => ({ measuredAtWallMs, thetaMs, deltaMs });
const stamp = (wallMs: number) => ({ wallMs, monoMs: 0, pageId: "p", offset: null });

describe("correctStamp", () => {
  it("adds the offset and reports δ/2 + 15 ppm × age (RFC 5905 §8, §9)", () => {
    const c = correctStamp(stamp(100_000), [est(0, 250, 40)]);
    expect(c.correctedMs).toBe(100_250);
    expect(c.uncertaintyMs).toBeCloseTo(20 + 15e-6 * 100_000, 9);
  });

  it("interpolates across an offline period between the estimates before and after", () => {
    // 1 h offline; the offset went from +100 ms to +160 ms: halfway it is +130 ms
    const c = correctStamp(stamp(1_800_000), [est(0, 100), est(3_600_000, 160)]);
    expect(c.correctedMs).toBeCloseTo(1_800_130, 6);
  });

  it("stores an unbounded uncertainty as null when the device never measured its clock", () => {
    expect(correctStamp(stamp(5), [])).toEqual({ correctedMs: 5, uncertaintyMs: null });
  });
});

describe("affectedWallRange", () => {
  it("is the span between the new estimate's neighbours", () => {
    const all = [est(0, 1), est(1000, 1), est(5000, 1)];
    expect(affectedWallRange(all, [est(1000, 1)])).toEqual([0, 5000]);
  });

  it("is open-ended past the first and last estimate", () => {
    const all = [est(0, 1), est(1000, 1)];
    expect(affectedWallRange(all, [est(1000, 1)])).toEqual([0, Number.POSITIVE_INFINITY]);
    expect(affectedWallRange(all, [est(0, 1)])).toEqual([Number.NEGATIVE_INFINITY, 1000]);
  });

  it("covers every moment whose correction changes (checked against correctStamp)", () => {
    const before = [est(0, 10), est(10_000, 30), est(20_000, 50)];
    const added = [est(12_000, 90)];
    const [lo, hi] = affectedWallRange([...before, ...added], added)!;
    for (let w = -5000; w <= 25_000; w += 250) {
      const changed = correctStamp(stamp(w), before).correctedMs !== correctStamp(stamp(w), [...before, ...added]).correctedMs;
      if (changed) expect(w > lo && w < hi).toBe(true);
    }
  });

  it("is null when nothing was added", () => {
    expect(affectedWallRange([est(0, 1)], [])).toBeNull();
  });
});
