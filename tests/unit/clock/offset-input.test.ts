import { describe, expect, it } from "vitest";
import { estimateOffset, estimateFromSamples } from "@/lib/clock";

describe("estimateOffset input checks", () => {
  it("throws a clear error on empty input", () => {
    expect(() => estimateOffset([])).toThrow(/at least one sample/);
  });

  it("throws on a non-finite time, naming the sample and field", () => {
    expect(() => estimateOffset([{ t1: 0, t2: 1, t3: 1, t4: 2 }, { t1: 0, t2: Number.NaN, t3: 1, t4: 2 }])).toThrow(/sample 1 .*t2/);
    expect(() => estimateOffset([{ t1: 0, t2: 1, t3: Infinity, t4: 2 }])).toThrow(/t3/);
  });

  it("skips a sample with negative delay (a clock stepped mid-exchange)", () => {
    // δ = (5−0) − (20−10) = −5 → skipped; the other: θ = ((110−100) + (111−103))/2 = 9, δ = 3 − 1 = 2
    const bad = { t1: 0, t2: 10, t3: 20, t4: 5 };
    const good = { t1: 100, t2: 110, t3: 111, t4: 103 };
    expect(estimateOffset([good, bad])).toEqual({ offsetMs: 9, delayMs: 2, boundMs: 1 });
  });

  it("throws when every sample has a negative delay", () => {
    expect(() => estimateOffset([{ t1: 0, t2: 10, t3: 20, t4: 5 }])).toThrow(/negative delay/);
  });

  it("estimateFromSamples stamps the chosen sample's T4 as the measurement time", () => {
    expect(estimateFromSamples([{ t1: 100, t2: 110, t3: 111, t4: 103 }])).toEqual({ thetaMs: 9, deltaMs: 2, measuredAtWallMs: 103 });
    expect(estimateFromSamples([{ t1: 0, t2: 10, t3: 20, t4: 5 }])).toBeNull();
  });
});
