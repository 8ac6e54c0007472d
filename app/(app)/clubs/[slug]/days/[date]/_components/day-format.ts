/** Formats of the Day board: times of day on the club's clock (its time zone), seconds, clock offsets. */
const formats = new Map<string, Intl.DateTimeFormat>();
function format(kind: "time" | "quarter" | "moment", timeZone: string): Intl.DateTimeFormat {
  const key = `${kind} ${timeZone}`;
  let f = formats.get(key);
  if (!f) {
    const options: Intl.DateTimeFormatOptions =
      kind === "time" ? { hour: "2-digit", minute: "2-digit", second: "2-digit" }
      : kind === "quarter" ? { hour: "2-digit", minute: "2-digit" }
      : { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" };
    f = new Intl.DateTimeFormat("en-GB", { ...options, timeZone });
    formats.set(key, f);
  }
  return f;
}
const dayFormat = new Intl.DateTimeFormat("en-GB", { weekday: "long", day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

export const timeText = (ms: number, timeZone: string): string => format("time", timeZone).format(ms);
export const quarterText = (ms: number, timeZone: string): string => format("quarter", timeZone).format(ms);
/** "4 Dec 2026, 17:30": when a day was closed or a decision made, on the club's clock. */
export const momentText = (iso: string, timeZone: string): string => format("moment", timeZone).format(Date.parse(iso));
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
