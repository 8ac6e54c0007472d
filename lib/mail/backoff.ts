/** How long a failed send waits before the next try: 1 minute, doubling, at most 6 hours; null = give up. */
export const MAX_MAIL_ATTEMPTS = 14; // about a day and a half of tries in all

export function retryDelayMs(attempts: number): number | null {
  if (attempts >= MAX_MAIL_ATTEMPTS) return null;
  return Math.min(6 * 3600_000, 60_000 * 2 ** Math.max(0, attempts - 1));
}
