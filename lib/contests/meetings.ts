/** Pairwise meetings of a draw: how often each two pilots flew in one group. */
export type Draw = number[][][]; // rounds → groups → pilot indices

export function meetingMatrix(pilots: number, draw: Draw): number[][] {
  const m = Array.from({ length: pilots }, () => new Array<number>(pilots).fill(0));
  for (const round of draw) {
    for (const group of round) {
      for (let i = 0; i < group.length; i++) {
        for (let j = i + 1; j < group.length; j++) {
          m[group[i]!]![group[j]!]! += 1;
          m[group[j]!]![group[i]!]! += 1;
        }
      }
    }
  }
  return m;
}

export type MeetingStats = { max: number; min: number; mean: number; stdDev: number; sumSquares: number };

/**
 * Max, min, mean and standard deviation of meetings over every pair of pilots (the draw's spread),
 * counting `before` (meetings of rounds already flown) too when given.
 */
export function meetingStats(pilots: number, draw: Draw, before?: ReadonlyArray<ReadonlyArray<number>>): MeetingStats {
  const m = meetingMatrix(pilots, draw);
  if (before) for (let i = 0; i < pilots; i++) for (let j = 0; j < pilots; j++) m[i]![j]! += before[i]?.[j] ?? 0;
  let max = 0, min = Infinity, sum = 0, sumSquares = 0, pairs = 0;
  for (let i = 0; i < pilots; i++) {
    for (let j = i + 1; j < pilots; j++) {
      const v = m[i]![j]!;
      max = Math.max(max, v);
      min = Math.min(min, v);
      sum += v;
      sumSquares += v * v;
      pairs += 1;
    }
  }
  if (pairs === 0) return { max: 0, min: 0, mean: 0, stdDev: 0, sumSquares: 0 };
  const mean = sum / pairs;
  return { max, min, mean, stdDev: Math.sqrt(Math.max(0, sumSquares / pairs - mean * mean)), sumSquares };
}
