import { describe, expect, it } from "vitest";
import { matchDayRuns } from "@/lib/days/matching";
import { dayBounds, isTimeZone, localDate, zoneOffsetMs } from "@/lib/days/time-zone";

const at = (iso: string) => Date.parse(iso);
const withSignal = (iso: string) => ({ signal: { atMs: [at(iso)] }, flights: [] });

// Offsets and change dates below are from the IANA tz database as shipped with Node's ICU
// (America/New_York: EST = UTC−5, EDT = UTC−4, EDT from 2nd Sunday in March 02:00, until 1st Sunday
// in November 02:00; Europe/Berlin: CET = UTC+1, CEST from last Sunday in March 02:00 CET).
describe("the club's clock", () => {
  it("a run at 23:30 local in New York is a different UTC date, and belongs to the local date", () => {
    const start = "2026-06-14T03:30:00Z"; // 23:30 EDT on 13 June
    const run = { runId: "late", sessionField: "North Meadow", chosen: false, createdAtMs: at(start) - 600_000, laneDerived: [withSignal(start)] };
    expect(localDate(at(start), "America/New_York")).toBe("2026-06-13");
    expect(matchDayRuns([run], "2026-06-13", ["North Meadow"], "America/New_York").map((r) => r.runId)).toEqual(["late"]);
    expect(matchDayRuns([run], "2026-06-14", ["North Meadow"], "America/New_York")).toEqual([]);
    // the same run for a club on UTC belongs to 14 June
    expect(matchDayRuns([run], "2026-06-14", ["North Meadow"]).map((r) => r.runId)).toEqual(["late"]);
    expect(matchDayRuns([run], "2026-06-13", ["North Meadow"])).toEqual([]);
  });

  it("a day runs from local midnight to local midnight, 23 or 25 hours on the days the clocks change", () => {
    expect(dayBounds("2026-06-13", "America/New_York")).toEqual({ startMs: at("2026-06-13T04:00:00Z"), endMs: at("2026-06-14T04:00:00Z") });
    expect(dayBounds("2026-03-29", "Europe/Berlin")).toEqual({ startMs: at("2026-03-28T23:00:00Z"), endMs: at("2026-03-29T22:00:00Z") });
    expect(dayBounds("2026-11-01", "America/New_York")).toEqual({ startMs: at("2026-11-01T04:00:00Z"), endMs: at("2026-11-02T05:00:00Z") });
    expect(dayBounds("2026-03-29")).toEqual({ startMs: at("2026-03-29T00:00:00Z"), endMs: at("2026-03-30T00:00:00Z") });
  });

  it("offsets east and west of Greenwich", () => {
    expect(zoneOffsetMs(at("2026-01-15T12:00:00Z"), "Europe/Berlin")).toBe(3600_000);
    expect(zoneOffsetMs(at("2026-01-15T12:00:00Z"), "America/New_York")).toBe(-5 * 3600_000);
    expect(zoneOffsetMs(at("2026-01-15T12:00:00Z"), "UTC")).toBe(0);
  });

  it("knows IANA names through Intl and nothing else", () => {
    expect(isTimeZone("Europe/Berlin")).toBe(true);
    expect(isTimeZone("UTC")).toBe(true);
    expect(isTimeZone("Mars/Olympus_Mons")).toBe(false);
    expect(isTimeZone("")).toBe(false);
    expect(isTimeZone("x".repeat(65))).toBe(false);
  });
});
