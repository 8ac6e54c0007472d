/** Tenths of a second as m:ss.t (e.g. 2391 → "3:59.1"). Truncates, never rounds up. */
export function formatTenths(tenths: number): string {
  const sign = tenths < 0 ? "−" : "";
  const t = Math.abs(Math.trunc(tenths));
  const minutes = Math.floor(t / 600);
  const seconds = Math.floor((t % 600) / 10);
  return `${sign}${minutes}:${String(seconds).padStart(2, "0")}.${t % 10}`;
}

/** Milliseconds as m:ss, rounding toward zero (a countdown shows the whole seconds left). */
export function formatClock(ms: number): string {
  const sign = ms < 0 ? "−" : "";
  const s = Math.floor(Math.abs(ms) / 1000);
  return `${sign}${Math.floor(s / 60)}:${String(s % 60).padStart(2, "0")}`;
}

/** Tenths as seconds with one decimal ("569.0 s"). */
export function formatSeconds(tenths: number): string {
  return `${(Math.trunc(tenths) / 10).toFixed(1)} s`;
}

const dateFormat = new Intl.DateTimeFormat("en-GB", { weekday: "short", day: "numeric", month: "short", year: "numeric" });

/** A session date, e.g. "Sat 14 Mar 2026". */
export function formatDate(date: Date): string {
  return dateFormat.format(date);
}
