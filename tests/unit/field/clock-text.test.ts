import { describe, expect, it } from "vitest";
import { dateTimeSecondsText, hourMinuteText, weekdayDateTimeText } from "@/lib/field/clock-text";

// Reference: the ICU formatter itself (Intl.DateTimeFormat, en-GB, the process's time zone) with the options each
// hand-written function stands in for. Every month and weekday, midnight, noon and single-digit fields.
const intl = (o: Intl.DateTimeFormatOptions) => new Intl.DateTimeFormat("en-GB", o);
const moments = [
  ...Array.from({ length: 12 }, (_, m) => new Date(2026, m, m + 1, (m * 5) % 24, (m * 7) % 60, (m * 11) % 60)),
  new Date(2026, 0, 1, 0, 0, 0),
  new Date(2026, 5, 30, 12, 0, 9),
  new Date(2027, 11, 31, 23, 59, 59),
];

describe("clock-text against Intl.DateTimeFormat (en-GB)", () => {
  it("hour and minute", () => {
    const f = intl({ hour: "2-digit", minute: "2-digit" });
    for (const d of moments) expect(hourMinuteText(d.getTime())).toBe(f.format(d));
  });
  it("weekday, date, hour and minute", () => {
    const f = intl({ weekday: "short", day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });
    for (const d of moments) expect(weekdayDateTimeText(d.getTime())).toBe(f.format(d));
  });
  it("date, hour, minute and second", () => {
    const f = intl({ day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", second: "2-digit" });
    for (const d of moments) expect(dateTimeSecondsText(d)).toBe(f.format(d));
  });
});
