import { normaliseUnits, type HalfRounding } from "./normalise";

/** One pilot's task result in a round (tenths of a second, as the task engine gives it). */
export type GroupResult = { pilotId: string; resultTenths: number };

/**
 * Scores a round: each group normalised on its own best (F3K.9.1). Returns round points in
 * tenths of a point per pilot. A pilot in two groups of the same round (a re-flight) keeps
 * the later group's score here; choosing which result stands (F3K.9.6) is the caller's.
 */
export function scoreRound(groups: readonly (readonly GroupResult[])[], halves: HalfRounding = "half-up"): Map<string, number> {
  const points = new Map<string, number>();
  for (const group of groups) {
    const normalised = normaliseUnits(group.map((g) => g.resultTenths), halves);
    group.forEach((g, i) => points.set(g.pilotId, normalised[i]!));
  }
  return points;
}
