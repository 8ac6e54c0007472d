import { describe, expect, it } from "vitest";
import { contestTotal } from "@/lib/scoring";

describe("contestTotal (F3K.10)", () => {
  it("5 rounds: nothing dropped", () => {
    // 1000 + 950.5 + 900 + 875.3 + 990 = 4715.8
    const r = contestTotal({ rounds: [1000, 950.5, 900, 875.3, 990], penalties: 0 });
    expect(r.total).toBe(4715.8);
    expect(r.dropped).toBeNull();
    expect(r.valid).toBe(true);
  });
  it("6 rounds: the lowest is dropped", () => {
    // sum 5590.9 − lowest 700.1 = 4890.8
    const r = contestTotal({ rounds: [1000, 950.5, 700.1, 975.3, 990, 975], penalties: 0 });
    expect(r.total).toBe(4890.8);
    expect(r.dropped).toEqual({ index: 2, score: 700.1, tenths: 7001 });
  });
  it("penalties stay even when their round is dropped", () => {
    // Same rounds; the 100-point penalty was given in round 3, the dropped one:
    // 4890.8 − 100 = 4790.8 (dropping the penalty with its round would give 4890.8).
    const r = contestTotal({ rounds: [1000, 950.5, 700.1, 975.3, 990, 975], penalties: [0, 0, 100, 0, 0, 0] });
    expect(r.dropped?.index).toBe(2);
    expect(r.total).toBe(4790.8);
    // A penalty in a kept round costs the same.
    expect(contestTotal({ rounds: [1000, 950.5, 700.1, 975.3, 990, 975], penalties: [100, 0, 0, 0, 0, 0] }).total).toBe(4790.8);
  });
  it("fewer than 5 rounds is not a valid contest", () => {
    expect(contestTotal({ rounds: [1000, 1000, 1000, 1000], penalties: 0 }).valid).toBe(false);
  });
  it("sums in integer tenths, free of float drift", () => {
    // 0.1 × 10 in floats is 0.9999999999999999; here it is exactly 1.
    expect(contestTotal({ rounds: Array(5).fill(0.1), penalties: 0 }).total).toBe(0.5);
    expect(contestTotal({ rounds: [0.1, 0.2, 0.3, 0.4, 0.5, 0.6], penalties: 0 }).total).toBe(2);
  });
  it("dropFrom: Infinity never drops", () => {
    expect(contestTotal({ rounds: [1, 2, 3, 4, 5, 6], penalties: 0, dropFrom: Infinity }).total).toBe(21);
  });
});
