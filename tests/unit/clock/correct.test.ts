import { describe, expect, it } from "vitest";
import { correctTime, elapsedBetween, judgeBoundary, type ClockEstimate } from "@/lib/clock";
import type { Stamp } from "@/lib/events/schema";

const est: ClockEstimate = { thetaMs: -1500, deltaMs: 30, measuredAtWallMs: 1_000_000 };
const stamp = (wallMs: number, monoMs: number, pageId = "p1", offset: ClockEstimate | null = est): Stamp => ({ wallMs, monoMs, pageId, offset });

describe("correctTime", () => {
  it("adds the stamp's own offset; bound δ/2 + 15 ppm × age", () => {
    // 100 s after measuring: 15 + 15e-6 × 100 000 = 16.5
    const got = correctTime(stamp(1_100_000, 5));
    expect(got.serverMs).toBe(1_098_500);
    expect(got.uncertaintyMs).toBeCloseTo(16.5, 9);
  });

  it("interpolates with a later measurement from the device's history", () => {
    const later: ClockEstimate = { thetaMs: -1400, deltaMs: 30, measuredAtWallMs: 3_000_000 };
    // halfway between 1 000 000 and 3 000 000: θ = −1450
    expect(correctTime(stamp(2_000_000, 5), [later]).serverMs).toBe(2_000_000 - 1450);
  });

  it("with no estimate at all returns the wall time with an unbounded uncertainty", () => {
    expect(correctTime(stamp(42, 0, "p", null))).toEqual({ serverMs: 42, uncertaintyMs: Infinity });
  });
});

describe("elapsedBetween", () => {
  it("uses the monotonic clock inside one page lifetime, immune to a wall-clock step", () => {
    // wall stepped back 300 ms between the taps; monotonic says 10 000 ms
    expect(elapsedBetween(stamp(1_000_000, 500), stamp(1_009_700, 10_500))).toEqual({ ms: 10_000, uncertaintyMs: 0, source: "monotonic" });
  });

  it("falls back to corrected wall time across a reload", () => {
    const got = elapsedBetween(stamp(1_000_000, 500, "p1"), stamp(1_010_000, 20, "p2"));
    expect(got.source).toBe("corrected-wall");
    expect(got.ms).toBe(10_000);
    expect(got.uncertaintyMs).toBeGreaterThan(30);
  });

  it("falls back to corrected wall time when the device slept (monotonic stopped)", () => {
    // 10 min of wall time, only 2 s of monotonic time
    const got = elapsedBetween(stamp(1_000_000, 500), stamp(1_600_000, 2500));
    expect(got).toMatchObject({ source: "corrected-wall", ms: 600_000 });
  });

  it("puts two devices on one timeline with their own offsets", () => {
    const phoneB: ClockEstimate = { thetaMs: 2000, deltaMs: 10, measuredAtWallMs: 1_000_000 };
    // A taps at wall 1 000 000 (server 998 500); B taps at wall 996 500 (server 998 500 + 0)
    const got = elapsedBetween(stamp(1_000_000, 1, "a"), stamp(996_500, 1, "b", phoneB), [est], [phoneB]);
    expect(got.ms).toBe(0);
  });
});

describe("judgeBoundary", () => {
  it("before / after when the intervals are apart", () => {
    expect(judgeBoundary(1000, 10, 1100, 20)).toBe("before");
    expect(judgeBoundary(1200, 10, 1100, 20)).toBe("after");
  });

  it("uncertain when the uncertainties straddle the boundary", () => {
    expect(judgeBoundary(1080, 10, 1100, 20)).toBe("uncertain");
    expect(judgeBoundary(1130, 10, 1100, 20)).toBe("uncertain"); // touching edges count as uncertain
    expect(judgeBoundary(1100, 0, 1100, 0)).toBe("uncertain"); // an exact tie is never guessed
    expect(judgeBoundary(0, Infinity, 1e12, 0)).toBe("uncertain");
  });

  it("rejects NaN and negative uncertainties", () => {
    expect(() => judgeBoundary(Number.NaN, 0, 0, 0)).toThrow(/NaN/);
    expect(() => judgeBoundary(0, -1, 0, 0)).toThrow(/≥ 0/);
  });
});
