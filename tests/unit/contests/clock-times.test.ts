import { describe, expect, it } from "vitest";
import { formatClock } from "@/lib/format";

/**
 * Contest times shown on the club's clock. Zone facts from the IANA time zone database as
 * remembered: Central Europe is UTC+1 (CET) until the last Sunday of March (29 March 2026) and
 * UTC+2 (CEST) in summer; New York moved to UTC−4 on the second Sunday of March (8 March 2026).
 */
describe("formatClock", () => {
  const march = new Date("2026-03-14T17:00:00Z");

  it("shows the club's local time with the zone's short name", () => {
    expect(formatClock(march, "Europe/Berlin")).toBe("Sat, 14 Mar 2026, 18:00 CET");
    expect(formatClock(new Date("2026-07-14T17:00:00Z"), "Europe/Berlin")).toBe("Tue, 14 Jul 2026, 19:00 CEST");
    expect(formatClock(march, "America/New_York", "short")).toBe("14 Mar, 13:00 GMT-4");
    expect(formatClock(march, "UTC", "time")).toBe("17:00 UTC");
  });

  it("a local date can differ from the UTC date", () => {
    expect(formatClock(new Date("2026-03-15T03:30:00Z"), "America/New_York", "short")).toBe("14 Mar, 23:30 GMT-4");
  });

  it("falls back to UTC for a zone it does not know", () => {
    expect(formatClock(march, "Nowhere/Field", "short")).toBe("14 Mar, 17:00 UTC");
  });
});
