/**
 * Rule arithmetic on time: integer milliseconds in, integer tenths of a second out.
 *
 * Flight times are recorded to 0.1 s and never rounded up (F3K.7: 183.96 s → 183.9 s),
 * so every conversion here truncates, and nothing downstream uses float seconds.
 */

/** Milliseconds → whole tenths of a second, truncated toward zero; negative durations are 0. */
export function msToTenths(ms: number): number {
  if (!(ms > 0)) return 0;
  // A stamp may carry sub-millisecond noise (e.g. 183999.9999): drop it first, then
  // divide an integer by 100 with integer arithmetic only.
  const whole = Math.floor(ms);
  return (whole - (whole % 100)) / 100;
}

/** Tenths → seconds as the float nearest the tenth (e.g. 5690 → 569, 1425 → 142.5). */
export function tenthsToSec(tenths: number): number {
  return tenths / 10;
}

/** Tenths as `m:ss.t` (e.g. 1839 → "3:03.9"), truncated, never rounded up; a minus sign when negative. */
export function formatTenths(tenths: number): string {
  const sign = tenths < 0 ? "−" : "";
  const t = Math.abs(Math.trunc(tenths));
  const minutes = Math.floor(t / 600);
  const seconds = Math.floor((t % 600) / 10);
  return `${sign}${minutes}:${String(seconds).padStart(2, "0")}.${t % 10}`;
}

/** Tenths as plain seconds with one decimal, e.g. 5690 → "569.0" (truncated, never rounded up). */
export function secondsText(tenths: number): string {
  return (Math.trunc(tenths) / 10).toFixed(1);
}
