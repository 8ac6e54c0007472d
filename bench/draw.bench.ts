/**
 * The draw against a random one: `npx tsx bench/draw.bench.ts`.
 * For 20, 40 and 60 pilots over 10 rounds (groups of at most 10), the maximum and the spread
 * (standard deviation, and max − min) of pairwise meetings for our draw, for random draws (the
 * worst and the median maximum of 20 seeds) and the lower bound ⌈R(g − 1)/(N − 1)⌉.
 * Goal (issue 15): ours never above the random draw's maximum and at most one above the bound.
 */
import { groupSizes, makeDraw, meetingLowerBound, meetingStats, randomDraw } from "@/lib/contests";

const ROUNDS = 10;
const MAX_GROUP = 10;
console.log("pilots  groups             bound  ours max  ours sd  ours max-min  random max (median/worst of 20)  random sd  ms");
for (const pilots of [20, 40, 60]) {
  const sizes = groupSizes(pilots, MAX_GROUP);
  const t0 = performance.now();
  const ours = makeDraw({ pilots, rounds: ROUNDS, maxGroupSize: MAX_GROUP, seed: 20261204 });
  const ms = performance.now() - t0;
  const randoms = Array.from({ length: 20 }, (_, s) => meetingStats(pilots, randomDraw({ pilots, rounds: ROUNDS, maxGroupSize: MAX_GROUP, seed: s + 1 })));
  const maxes = randoms.map((r) => r.max).sort((a, b) => a - b);
  const sd = randoms.reduce((s, r) => s + r.stdDev, 0) / randoms.length;
  const bound = meetingLowerBound(pilots, ROUNDS, sizes);
  console.log(
    `${String(pilots).padEnd(8)}${sizes.join("/").padEnd(19)}${String(bound).padEnd(7)}${String(ours.stats.max).padEnd(10)}` +
      `${ours.stats.stdDev.toFixed(2).padEnd(9)}${String(ours.stats.max - ours.stats.min).padEnd(14)}` +
      `${`${maxes[10]}/${maxes[19]}`.padEnd(33)}${sd.toFixed(2).padEnd(11)}${ms.toFixed(0)}`,
  );
  console.log(`        ours/random max ${(ours.stats.max / maxes[10]!).toFixed(2)}, ours − bound ${ours.stats.max - bound}`);
}
