/**
 * Dates and times as the field's screens show them (British English, the phone's own time zone), written
 * out by hand: the first `Intl.DateTimeFormat` a page builds loads the locale's calendar data and was one
 * long task of ~0.4 s at 4× CPU on /field's first load (bench/cpu-probe.ts, DEVELOPERS.md "Page load").
 * Each function gives what `Intl.DateTimeFormat("en-GB", …)` gives for the options named beside it
 * (tests/unit/field/clock-text.test.ts compares them).
 */
const WEEKDAYS = ["Sun", "Mon", "Tue", "Wed", "Thu", "Fri", "Sat"] as const;
const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sept", "Oct", "Nov", "Dec"] as const;

const two = (n: number) => String(n).padStart(2, "0");

/** "09:07" — { hour: "2-digit", minute: "2-digit" }. */
export function hourMinuteText(at: number | Date): string {
  const d = new Date(at);
  return `${two(d.getHours())}:${two(d.getMinutes())}`;
}

/** "Sat 5 Dec, 09:07" — { weekday: "short", day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" }. */
export function weekdayDateTimeText(at: number | Date): string {
  const d = new Date(at);
  return `${WEEKDAYS[d.getDay()]} ${d.getDate()} ${MONTHS[d.getMonth()]}, ${hourMinuteText(d)}`;
}

/** "5 Dec, 09:07:03" — { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", second: "2-digit" }. */
export function dateTimeSecondsText(at: number | Date): string {
  const d = new Date(at);
  return `${d.getDate()} ${MONTHS[d.getMonth()]}, ${hourMinuteText(d)}:${two(d.getSeconds())}`;
}
