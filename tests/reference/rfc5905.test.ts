import { describe, expect, it } from "vitest";
import { DRIFT_RATE, boundAt, estimateOffset, sampleDelay, sampleOffset } from "@/lib/clock";

// Checks against RFC 5905 (Network Time Protocol Version 4).
// §8 (on-wire protocol) defines, with T1 = client send, T2 = server receive,
// T3 = server send, T4 = client receive:
//   offset θ = ((T2 − T1) + (T3 − T4)) / 2      delay δ = (T4 − T1) − (T3 − T2)
// The RFC gives the formulas, not numbers: every expected value below was worked by hand
// from those formulas and is shown step by step.

describe("RFC 5905 §8 on-wire offset and delay", () => {
  it("server 240 ms ahead, symmetric 10 ms legs, 10 ms processing", () => {
    // T1=1000 T2=1250 T3=1260 T4=1030
    // θ = ((1250−1000) + (1260−1030)) / 2 = (250 + 230) / 2 = 240
    // δ = (1030−1000) − (1260−1250) = 30 − 10 = 20
    const s = { t1: 1000, t2: 1250, t3: 1260, t4: 1030 };
    expect(sampleOffset(s)).toBe(240);
    expect(sampleDelay(s)).toBe(20);
    expect(estimateOffset([s])).toEqual({ offsetMs: 240, delayMs: 20, boundMs: 10 });
  });

  it("device 500 ms ahead, asymmetric legs (30 ms out, 10 ms back): error within δ/2", () => {
    // true θ = −500; out leg 30, back leg 10, processing 5
    // T1=10000  T2 = 10000+30−500 = 9530  T3 = 9535  T4 = 9535+500+10 = 10045
    // θ = ((9530−10000) + (9535−10045)) / 2 = (−470 − 510) / 2 = −490
    // δ = (10045−10000) − (9535−9530) = 45 − 5 = 40, so δ/2 = 20
    // error |−490 − (−500)| = 10 = (30 − 10)/2 ≤ 20 — the §8 asymmetry bound
    const est = estimateOffset([{ t1: 10_000, t2: 9530, t3: 9535, t4: 10_045 }]);
    expect(est).toEqual({ offsetMs: -490, delayMs: 40, boundMs: 20 });
    expect(Math.abs(est.offsetMs - -500)).toBeLessThanOrEqual(est.boundMs);
  });

  it("half-millisecond results are kept, not rounded", () => {
    // T1=0 T2=100 T3=100 T4=1 → θ = ((100−0) + (100−1))/2 = 199/2 = 99.5, δ = (1−0) − (100−100) = 1
    expect(estimateOffset([{ t1: 0, t2: 100, t3: 100, t4: 1 }])).toEqual({ offsetMs: 99.5, delayMs: 1, boundMs: 0.5 });
  });
});

describe("RFC 5905 §10 clock filter: last 8 samples, least delay", () => {
  // Samples with true θ = 100 and growing asymmetric delays; per sample (out u, back d):
  // T1 = 1000·i, T2 = T1 + u + 100, T3 = T2 + 1, T4 = T3 − 100 + d
  // → θ = 100 + (u − d)/2, δ = u + d
  const mk = (i: number, u: number, d: number) => {
    const t1 = 1000 * i;
    const t2 = t1 + u + 100;
    const t3 = t2 + 1;
    return { t1, t2, t3, t4: t3 - 100 + d };
  };

  it("picks the least-delay sample among 8", () => {
    // delays (u+d): 50, 30, 12 (u=8,d=4 → θ = 102), 40, 60, 25, 33, 90
    const samples = [mk(0, 25, 25), mk(1, 15, 15), mk(2, 8, 4), mk(3, 20, 20), mk(4, 30, 30), mk(5, 5, 20), mk(6, 3, 30), mk(7, 45, 45)];
    expect(estimateOffset(samples)).toEqual({ offsetMs: 102, delayMs: 12, boundMs: 6 });
  });

  it("a ninth sample pushes the oldest out of the filter, even if it had the least delay", () => {
    // sample 0: δ = 2 (θ = 100); samples 1..8: δ = 20, except sample 6: u=12,d=4 → δ = 16, θ = 104
    const samples = [mk(0, 1, 1), ...[1, 2, 3, 4, 5].map((i) => mk(i, 10, 10)), mk(6, 12, 4), mk(7, 10, 10), mk(8, 10, 10)];
    expect(samples).toHaveLength(9);
    expect(estimateOffset(samples)).toEqual({ offsetMs: 104, delayMs: 16, boundMs: 8 });
    expect(estimateOffset(samples.slice(0, 8))).toEqual({ offsetMs: 100, delayMs: 2, boundMs: 1 });
  });
});

describe("drift at 15 ppm", () => {
  it("15e-6 × 86 400 s = 1.296 s a day, matching the ~1.3 s/day SYNC.md cites from RFC 5905 §9", () => {
    // RFC 5905 sets the frequency tolerance PHI to 15 ppm (section number from memory: the
    // parameter table of §7.2; SYNC.md cites §9 for "about 1.3 s per day").
    expect(DRIFT_RATE).toBe(15e-6);
    const day = 86_400_000;
    const est = { thetaMs: 0, deltaMs: 20, measuredAtWallMs: 0 };
    // δ/2 + 15e-6 × 86 400 000 ms = 10 + 1296 = 1306
    expect(boundAt(est, day)).toBeCloseTo(1306, 9);
    expect(boundAt(est, day) - boundAt(est, 0)).toBeCloseTo(1296, 9);
  });
});
