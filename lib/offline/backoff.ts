/** First retry delay after a failed sync. */
export const BACKOFF_BASE_MS = 1000;
/** Longest wait between automatic retries: a stall never lasts longer than this. */
export const BACKOFF_CAP_MS = 60_000;

/**
 * Delay before automatic retry number `failures` (1 = after the first failure):
 * exponential, capped, with "equal jitter" — half fixed, half random — so devices that
 * failed together do not retry together, yet the wait still grows.
 */
export function backoffDelay(failures: number, random: () => number = Math.random): number {
  const exp = Math.min(BACKOFF_CAP_MS, BACKOFF_BASE_MS * 2 ** Math.max(0, failures - 1));
  return exp / 2 + random() * (exp / 2);
}
