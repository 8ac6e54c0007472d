/**
 * A pilot's contest total (F3K.10): round scores summed, the lowest dropped from 6 rounds
 * flown, penalties subtracted at the end — they stay even when their round is dropped.
 * All arithmetic in integer tenths of a point.
 */

export type ContestTotalInput = {
  /** Normalised round scores in points (0.1 point resolution), in round order. */
  rounds: number[];
  /**
   * Penalty points of the contest (every round, dropped or not): a total, or one entry per
   * round in round order.
   */
  penalties: number | readonly number[];
  /** Drop the lowest round from this many rounds (default 6; Infinity = never). */
  dropFrom?: number;
};

export type ContestTotal = {
  /** The final score in points. */
  total: number;
  totalTenths: number;
  /** Sum of the rounds kept, before penalties, in tenths. */
  keptTenths: number;
  /** The dropped round (index and score), or null when fewer rounds than `dropFrom`. */
  dropped: { index: number; score: number; tenths: number } | null;
  penaltyTenths: number;
  /** F3K.10: a contest needs at least 5 rounds to be valid. */
  valid: boolean;
};

export const MIN_VALID_ROUNDS = 5;
export const DROP_FROM_ROUNDS = 6;

const toTenths = (points: number) => (Number.isFinite(points) ? Math.round(points * 10) : 0);

/**
 * Computes a pilot's total. When several rounds tie for lowest, the first of them is the
 * one reported as dropped (the total is the same either way). The total may go below zero
 * when penalties exceed the points (kept as computed, not clamped).
 */
export function contestTotal(input: ContestTotalInput): ContestTotal {
  const tenths = input.rounds.map(toTenths);
  const dropFrom = input.dropFrom ?? DROP_FROM_ROUNDS;
  let dropped: ContestTotal["dropped"] = null;
  if (tenths.length >= dropFrom && tenths.length > 0) {
    let index = 0;
    for (let i = 1; i < tenths.length; i++) if (tenths[i]! < tenths[index]!) index = i;
    dropped = { index, score: tenths[index]! / 10, tenths: tenths[index]! };
  }
  const sum = tenths.reduce((a, b) => a + b, 0);
  const keptTenths = sum - (dropped?.tenths ?? 0);
  const penaltyTenths = typeof input.penalties === "number" ? toTenths(input.penalties) : input.penalties.reduce((sum, p) => sum + toTenths(p), 0);
  const totalTenths = keptTenths - penaltyTenths;
  return { total: totalTenths / 10, totalTenths, keptTenths, dropped, penaltyTenths, valid: tenths.length >= MIN_VALID_ROUNDS };
}
