import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { offsetAt, pruneEstimates, type ClockEstimate } from "@/lib/clock";

const at = (measuredAtWallMs: number, deltaMs: number, thetaMs = 100): ClockEstimate => ({ thetaMs, deltaMs, measuredAtWallMs });
const HOUR = 3_600_000;

describe("pruneEstimates (at most 32 clock estimates per device)", () => {
  it("keeps the lone estimates either side of an offline period and thins a dense online run by delay", () => {
    // online: one burst a minute for 2 hours; then 6 h offline; then one burst after
    const online = Array.from({ length: 120 }, (_, i) => at(i * 60_000, 10 + ((i * 37) % 50)));
    const lastBeforeGap = online.at(-1)!;
    const afterGap = at(lastBeforeGap.measuredAtWallMs + 6 * HOUR, 30, 400);
    const kept = pruneEstimates([...online, afterGap], 32);
    expect(kept).toHaveLength(32);
    expect(kept).toContainEqual(afterGap);
    // interpolation across the gap still has an estimate close before it
    const before = kept.filter((e) => e.measuredAtWallMs < afterGap.measuredAtWallMs).at(-1)!;
    expect(lastBeforeGap.measuredAtWallMs - before.measuredAtWallMs).toBeLessThanOrEqual(10 * 60_000);
    // the worst-delay bursts are the ones dropped: the kept online ones are mostly the best
    const keptOnline = kept.filter((e) => e !== afterGap);
    const meanKept = keptOnline.reduce((s, e) => s + e.deltaMs, 0) / keptOnline.length;
    const meanAll = online.reduce((s, e) => s + e.deltaMs, 0) / online.length;
    expect(meanKept).toBeLessThan(meanAll);
  });

  it("corrects a run by the estimates measured closest in time to it, not by a lower-δ one from far away (RFC 5905 §8: error ≤ δ/2; drift at PHI = 15 ppm)", () => {
    // a very good estimate (δ 2 ms, θ 100) a day before the run, a worse one (δ 40 ms, θ 400) a minute before it
    const far = at(0, 2, 100);
    const near = at(24 * HOUR - 60_000, 40, 400);
    const runAt = 24 * HOUR;
    const used = offsetAt(pruneEstimates([far, near]), runAt)!;
    expect(used.thetaMs).toBe(400);
    // its bound: δ/2 + 15 ppm × 60 s = 20 + 0.9 ms; the far one's would be 1 + 15 ppm × 24 h = 1 + 1296 ms
    expect(used.uncertaintyMs).toBeCloseTo(20.9, 6);
  });

  it("never keeps more than the cap, keeps everything under it, and returns a subset oldest first", () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: 10 ** 9 }), { maxLength: 120 }),
        fc.integer({ min: 1, max: 40 }),
        (times, max) => {
          const all = times.map((t, i) => at(t, (i * 13) % 97));
          const kept = pruneEstimates(all, max);
          expect(kept.length).toBe(Math.min(all.length, max));
          for (const e of kept) expect(all).toContain(e);
          for (let i = 1; i < kept.length; i++) expect(kept[i]!.measuredAtWallMs).toBeGreaterThan(kept[i - 1]!.measuredAtWallMs);
          // the newest and oldest moments stay covered within the densest spacing
          if (all.length > 0) expect(offsetAt(kept, Math.max(...times))).not.toBeNull();
        },
      ),
      { numRuns: 200 },
    );
  });
});
