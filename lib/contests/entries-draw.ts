import { makeDraw, type DrawResult } from "./draw";

export type DrawEntry = { id: string; keepApart: string | null };

/**
 * The draw for a contest's live entries: entries sorted by id (so the same entries and seed give
 * the same draw whatever order they were read in), entries sharing a keep-apart word kept apart.
 */
export function drawEntries(p: { entries: DrawEntry[]; rounds: number[]; maxGroupSize: number; seed: number }): {
  rounds: { roundNumber: number; groups: string[][] }[];
  result: DrawResult;
} {
  const sorted = [...p.entries].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const apart: [number, number][] = [];
  sorted.forEach((a, i) => sorted.forEach((b, j) => {
    if (i < j && a.keepApart && a.keepApart.toLowerCase() === b.keepApart?.toLowerCase()) apart.push([i, j]);
  }));
  const result = makeDraw({ pilots: sorted.length, rounds: p.rounds.length, maxGroupSize: p.maxGroupSize, seed: p.seed, apart });
  return {
    rounds: result.rounds.map((groups, r) => ({ roundNumber: p.rounds[r]!, groups: groups.map((g) => g.map((i) => sorted[i]!.id)) })),
    result,
  };
}
