import { describe, expect, it } from "vitest";
import { detectLaunches } from "@/lib/altimeter/detect";
import { generateTrace } from "./trace";

// The tolerances lib/altimeter/detect.ts documents: each launch within 0.5 s and 1 m.
const TIME_MS = 500;
const HEIGHT_M = 1;

describe("launch detection on generated traces (lib/altimeter/detect.ts)", () => {
  const cases = [1, 2, 5, 10, 20].flatMap((hz) => [0, 0.05, 0.15].flatMap((noiseM) => [1, 2, 3].map((seed) => ({ hz, noiseM, seed }))));
  it.each(cases)("finds every launch at $hz Hz with noise σ $noiseM m (seed $seed)", ({ hz, noiseM, seed }) => {
    const { samples, launches } = generateTrace({ seed: seed * 1000 + hz, hz, noiseM, launches: 5, groundM: 120 + seed });
    const found = detectLaunches(samples);
    expect(found).toHaveLength(launches.length);
    launches.forEach((known, k) => {
      const got = found[k]!;
      expect(Math.abs(got.atMs - known.atMs), `launch ${k} time`).toBeLessThanOrEqual(TIME_MS);
      expect(Math.abs(got.heightM - known.heightM), `launch ${k} height`).toBeLessThanOrEqual(HEIGHT_M);
    });
  });

  it("finds nothing in a trace that never leaves the ground, nor in a slow thermal climb from altitude", () => {
    const still = generateTrace({ seed: 7, hz: 10, noiseM: 0.15, launches: 0 }).samples;
    expect(detectLaunches(still)).toEqual([]);
    const thermal = Array.from({ length: 600 }, (_, i) => ({ tMs: i * 100, hM: 50 + i * 0.2 })); // 2 m/s from 50 m up
    expect(detectLaunches(thermal)).toEqual([]);
  });

  it("does not count a hand carry or a short hop (less than 10 m gained)", () => {
    const hop = Array.from({ length: 300 }, (_, i) => ({ tMs: i * 100, hM: i >= 100 && i < 140 ? 6 * Math.sin((Math.PI * (i - 100)) / 40) : 0 }));
    expect(detectLaunches(hop)).toEqual([]);
  });
});
