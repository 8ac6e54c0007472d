import { describe, expect, it } from "vitest";
import { groupSizes, makeDraw, meetingLowerBound, meetingMatrix, meetingStats, randomDraw } from "@/lib/contests";

describe("group sizes (F3K.9.1: as few groups as possible, at least 5 pilots each)", () => {
  it("uses the fewest groups the largest size allows, sizes within one of each other", () => {
    expect(groupSizes(20, 10)).toEqual([10, 10]);
    expect(groupSizes(23, 10)).toEqual([8, 8, 7]);
    expect(groupSizes(60, 8)).toEqual([8, 8, 8, 8, 7, 7, 7, 7]);
  });
  it("never makes a group under 5 pilots: 11 pilots at most 5 a group become 6 + 5", () => {
    expect(groupSizes(11, 5)).toEqual([6, 5]);
    expect(groupSizes(9, 4)).toEqual([9]);
    expect(groupSizes(3, 10)).toEqual([3]);
  });
});

describe("the lower bound ⌈R(g − 1)/(N − 1)⌉ (F3K.9.1 groups, the social golfer counting argument)", () => {
  it("is computed from the largest group", () => {
    expect(meetingLowerBound(20, 10, [10, 10])).toBe(5); // 10·9/19 = 4.7
    expect(meetingLowerBound(40, 10, [10, 10, 10, 10])).toBe(3); // 90/39 = 2.3
    expect(meetingLowerBound(60, 10, [10, 10, 10, 10, 10, 10])).toBe(2); // 90/59 = 1.5
    expect(meetingLowerBound(11, 5, [6, 5])).toBe(3); // 5·5/10 = 2.5
  });
  it("holds for every draw (a random one and ours)", () => {
    for (const pilots of [12, 20, 33]) {
      const sizes = groupSizes(pilots, 8);
      const bound = meetingLowerBound(pilots, 7, sizes);
      expect(meetingStats(pilots, randomDraw({ pilots, rounds: 7, maxGroupSize: 8, seed: 3 })).max).toBeGreaterThanOrEqual(bound);
      expect(makeDraw({ pilots, rounds: 7, maxGroupSize: 8, seed: 3 }).stats.max).toBeGreaterThanOrEqual(bound);
    }
  });
});

describe("the draw (F3K.9.1: groups of at least 5, different compositions each round)", () => {
  it("puts every pilot in exactly one group of each round, with the planned sizes", () => {
    const d = makeDraw({ pilots: 23, rounds: 6, maxGroupSize: 10, seed: 42 });
    expect(d.rounds).toHaveLength(6);
    for (const round of d.rounds) {
      expect(round.map((g) => g.length)).toEqual(groupSizes(23, 10));
      expect(round.flat().sort((a, b) => a - b)).toEqual(Array.from({ length: 23 }, (_, i) => i));
    }
  });
  it("is deterministic from its seed, and another seed gives another draw", () => {
    const a = makeDraw({ pilots: 20, rounds: 5, maxGroupSize: 10, seed: 99 });
    expect(makeDraw({ pilots: 20, rounds: 5, maxGroupSize: 10, seed: 99 }).rounds).toEqual(a.rounds);
    expect(makeDraw({ pilots: 20, rounds: 5, maxGroupSize: 10, seed: 100 }).rounds).not.toEqual(a.rounds);
  });
  it("never does worse than a random draw on 20, 40 and 60 pilots over 10 rounds, and stays within one of the bound", () => {
    for (const pilots of [20, 40, 60]) {
      const ours = makeDraw({ pilots, rounds: 10, maxGroupSize: 10, seed: 7 });
      const bound = meetingLowerBound(pilots, 10, groupSizes(pilots, 10));
      for (let seed = 1; seed <= 5; seed++) {
        const random = meetingStats(pilots, randomDraw({ pilots, rounds: 10, maxGroupSize: 10, seed }));
        expect(ours.stats.max).toBeLessThanOrEqual(random.max);
        expect(ours.stats.stdDev).toBeLessThanOrEqual(random.stdDev);
      }
      expect(ours.stats.max).toBeLessThanOrEqual(bound + 1);
    }
  });
  it("never puts pilots kept apart (a shared timekeeper or helper) in one group", () => {
    const apart: [number, number][] = [[0, 1], [0, 2], [1, 2], [5, 9]];
    const d = makeDraw({ pilots: 15, rounds: 8, maxGroupSize: 5, seed: 5, apart });
    expect(d.apartBroken).toBe(0);
    const m = meetingMatrix(15, d.rounds);
    for (const [x, y] of apart) expect(m[x]![y]).toBe(0);
  });
  it("reports, rather than hides, a constraint no draw can keep (three pilots apart, two groups)", () => {
    const d = makeDraw({ pilots: 10, rounds: 2, maxGroupSize: 5, seed: 1, apart: [[0, 1], [0, 2], [1, 2]] });
    expect(d.apartBroken).toBeGreaterThan(0);
  });
});
