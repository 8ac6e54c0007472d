import { mulberry32 } from "../random";
import { groupSizes } from "./groups";
import { meetingStats, type Draw, type MeetingStats } from "./meetings";
import { shuffle } from "./random-draw";

export type DrawInput = {
  pilots: number;
  rounds: number;
  maxGroupSize: number;
  /** Index pairs never to share a group (a shared timekeeper or helper, family on request). */
  apart?: ReadonlyArray<readonly [number, number]>;
  seed: number;
  /** Whole draws tried from seeds derived from `seed`; the best is kept. */
  attempts?: number;
  /** Meetings already flown (pilot × pilot), for a re-draw of the remaining rounds: they count as met. */
  met?: ReadonlyArray<ReadonlyArray<number>>;
};

export type DrawResult = { rounds: Draw; seed: number; stats: MeetingStats; apartBroken: number };

const APART = 1e12;

/**
 * The draw: round by round, a seeded greedy placement then pair swaps between groups while any
 * swap lowers the cost, where two pilots in one group cost 8^(times they already met) — so a
 * third meeting outweighs many first ones and the maximum stays low — and a pair kept apart costs
 * more than any meetings could. Several whole draws from derived seeds; the one with the lowest
 * maximum, then the smallest sum of squared meetings (the spread), wins. Same input, same draw.
 */
export function makeDraw(input: DrawInput): DrawResult {
  const attempts = Math.max(1, input.attempts ?? 6);
  let best: DrawResult | null = null;
  for (let a = 0; a < attempts; a++) {
    const rounds = drawOnce(input, mulberry32((input.seed ^ Math.imul(a + 1, 0x9e3779b1)) >>> 0));
    const stats = meetingStats(input.pilots, rounds, input.met);
    const apartBroken = countApart(rounds, input.apart ?? []);
    const candidate = { rounds, seed: input.seed, stats, apartBroken };
    if (!best || better(candidate, best)) best = candidate;
  }
  return best!;
}

function better(a: DrawResult, b: DrawResult): boolean {
  if (a.apartBroken !== b.apartBroken) return a.apartBroken < b.apartBroken;
  if (a.stats.max !== b.stats.max) return a.stats.max < b.stats.max;
  return a.stats.sumSquares < b.stats.sumSquares;
}

function countApart(draw: Draw, apart: ReadonlyArray<readonly [number, number]>): number {
  let n = 0;
  for (const round of draw) {
    const groupOf = new Map<number, number>();
    round.forEach((g, gi) => g.forEach((p) => groupOf.set(p, gi)));
    for (const [x, y] of apart) if (x !== y && groupOf.get(x) === groupOf.get(y)) n += 1;
  }
  return n;
}

function drawOnce(input: DrawInput, random: () => number): Draw {
  const n = input.pilots;
  const sizes = groupSizes(n, input.maxGroupSize);
  const met = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => input.met?.[i]?.[j] ?? 0));
  const apart = Array.from({ length: n }, () => new Array<boolean>(n).fill(false));
  for (const [x, y] of input.apart ?? []) {
    if (x === y || x < 0 || y < 0 || x >= n || y >= n) continue;
    apart[x]![y] = apart[y]![x] = true;
  }
  const cost = (p: number, q: number) => (apart[p]![q] ? APART : 8 ** met[p]![q]!);
  const all = Array.from({ length: n }, (_, i) => i);
  const draw: Draw = [];
  for (let r = 0; r < input.rounds; r++) {
    const groups = placeGreedy(shuffle(all, random), sizes, cost);
    improveBySwaps(groups, cost);
    for (const g of groups) for (const p of g) for (const q of g) if (p !== q) met[p]![q]! += 1;
    draw.push(groups.map((g) => [...g].sort((x, y) => x - y)));
  }
  return draw;
}

function placeGreedy(order: number[], sizes: number[], cost: (p: number, q: number) => number): number[][] {
  const groups = sizes.map(() => [] as number[]);
  for (const p of order) {
    let pick = -1, pickCost = Infinity;
    groups.forEach((g, gi) => {
      if (g.length >= sizes[gi]!) return;
      const c = g.reduce((s, q) => s + cost(p, q), 0);
      if (c < pickCost || (c === pickCost && g.length < groups[pick]!.length)) { pick = gi; pickCost = c; }
    });
    groups[pick]!.push(p);
  }
  return groups;
}

function costIn(p: number, group: number[], without: number, cost: (p: number, q: number) => number): number {
  let s = 0;
  for (const q of group) if (q !== p && q !== without) s += cost(p, q);
  return s;
}

/** Swaps two pilots of different groups while that lowers the round's cost (a local minimum). */
function improveBySwaps(groups: number[][], cost: (p: number, q: number) => number): void {
  for (let pass = 0; pass < 40; pass++) {
    let improved = false;
    for (let a = 0; a < groups.length; a++) {
      for (let b = a + 1; b < groups.length; b++) {
        const A = groups[a]!, B = groups[b]!;
        for (let i = 0; i < A.length; i++) {
          for (let j = 0; j < B.length; j++) {
            const p = A[i]!, q = B[j]!;
            const now = costIn(p, A, p, cost) + costIn(q, B, q, cost);
            const then = costIn(p, B, q, cost) + costIn(q, A, p, cost);
            if (then < now) { A[i] = q; B[j] = p; improved = true; }
          }
        }
      }
    }
    if (!improved) return;
  }
}
