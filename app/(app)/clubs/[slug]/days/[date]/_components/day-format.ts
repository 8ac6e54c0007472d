/** Formats of the Day board: times of day in UTC (the day's own clock), seconds, clock offsets. */
const timeFormat = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", second: "2-digit", timeZone: "UTC" });
const quarterFormat = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", timeZone: "UTC" });
const dayFormat = new Intl.DateTimeFormat("en-GB", { weekday: "long", day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

export const timeText = (ms: number): string => timeFormat.format(ms);
export const quarterText = (ms: number): string => quarterFormat.format(ms);
export const dayTitle = (day: string): string => dayFormat.format(new Date(`${day}T12:00:00Z`));

/** θ = server − phone: positive means the phone's clock is behind. "15 min 0.000 s behind", "0.012 s ahead", "on time". */
export function offsetText(thetaMs: number): string {
  const abs = Math.abs(thetaMs);
  if (abs < 0.5) return "on time";
  const min = Math.floor(abs / 60_000);
  const sec = ((abs - min * 60_000) / 1000).toFixed(3);
  return `${min > 0 ? `${min} min ` : ""}${sec} s ${thetaMs > 0 ? "behind" : "ahead"}`;
}

export const uncertaintyText = (ms: number): string => `± ${ms < 10 ? ms.toFixed(1) : Math.round(ms)} ms`;
