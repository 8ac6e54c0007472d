/**
 * Normalised scores within a group (F3K.9.1, F3K.10): result / best result × 1000,
 * to 0.1 point. Computed in integers: results are scaled to thousandths of a second and
 * the quotient is rounded by comparing the integer remainder, never a float.
 */

/**
 * How an exact half of 0.1 point rounds (AMBIGUOUS in the rules). Default "half-up":
 * 0.05 rounds up, in the pilot's favour. "half-even" and "down" (truncate) are settings.
 */
export type HalfRounding = "half-up" | "half-even" | "down";

const SCALE = 1000; // results carry at most three decimals of a second

/** Points in tenths (integers) for results already in integer units (e.g. tenths of a second). */
export function normaliseUnits(results: readonly number[], halves: HalfRounding = "half-up"): number[] {
  let best = 0;
  for (const r of results) if (r > best) best = r;
  if (best <= 0) return results.map(() => 0);
  return results.map((r) => divideRounded(Math.max(0, r) * 10_000, best, halves));
}

/**
 * Normalises a group's results (seconds, e.g. 130, 142.5) to points (e.g. 812.5, 1000):
 * the best gets 1000, a zero gets 0, everyone else result / best × 1000 to 0.1 point.
 */
export function normaliseGroup(results: number[], options: { halves?: HalfRounding } = {}): number[] {
  const units = results.map((r) => (Number.isFinite(r) && r > 0 ? Math.round(r * SCALE) : 0));
  return normaliseUnits(units, options.halves).map((tenths) => tenths / 10);
}

/** Integer division num / den rounded to the nearest integer, halves by `halves` (num, den ≥ 0 integers). */
export function divideRounded(num: number, den: number, halves: HalfRounding): number {
  const q = Math.floor(num / den);
  const rem = num - q * den;
  if (halves === "down") return q;
  const twice = 2 * rem;
  if (twice > den) return q + 1;
  if (twice < den) return q;
  return halves === "half-up" || q % 2 === 1 ? q + 1 : q;
}
