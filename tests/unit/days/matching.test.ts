import { describe, expect, it } from "vitest";
import { dayBounds, fieldKey, matchDayRuns, runStartMs } from "@/lib/days/matching";
import { dayLabel } from "@/lib/days/summary";

const at = (iso: string) => Date.parse(iso);
const withSignal = (iso: string) => ({ signal: { atMs: [at(iso)] }, flights: [] });
const withLaunch = (iso: string) => ({ signal: null, flights: [{ index: 0, launchAtMs: at(iso), landAtMs: at(iso) + 30_000, timeTenths: 300 }] });

describe("runStartMs", () => {
  it("takes the earliest corrected working-time signal of any lane", () => {
    expect(runStartMs([withSignal("2026-06-14T10:00:05Z"), withSignal("2026-06-14T10:00:01Z")], at("2026-06-13T23:00:00Z"))).toBe(at("2026-06-14T10:00:01Z"));
  });
  it("falls back to the earliest launch, then to the phone's set-up time", () => {
    expect(runStartMs([withLaunch("2026-06-14T10:02:00Z"), null], 0)).toBe(at("2026-06-14T10:02:00Z"));
    expect(runStartMs([null, { flights: [] }], at("2026-06-14T09:00:00Z"))).toBe(at("2026-06-14T09:00:00Z"));
  });
});

describe("matchDayRuns", () => {
  const run = (runId: string, sessionField: string, startIso: string, chosen = false) => ({
    runId, sessionField, chosen, createdAtMs: at(startIso) - 900_000, laneDerived: [withSignal(startIso)],
  });
  it("keeps runs at the day's fields whose corrected start is within the UTC day [00:00, 24:00), and chosen ones anywhere", () => {
    const got = matchDayRuns(
      [
        run("midnight", "North Meadow", "2026-06-14T00:00:00Z"),
        run("last-ms", " north   MEADOW ", "2026-06-14T23:59:59.999Z"),
        run("next-day", "North Meadow", "2026-06-15T00:00:00Z"),
        run("day-before", "North Meadow", "2026-06-13T23:59:59.999Z"),
        run("other-field", "South Field", "2026-06-14T12:00:00Z"),
        run("chosen", "Elsewhere", "2026-06-10T12:00:00Z", true),
      ],
      "2026-06-14",
      ["North Meadow"],
    );
    expect(got.map((r) => r.runId)).toEqual(["chosen", "midnight", "last-ms"]);
    expect(got[1]!.startMs).toBe(at("2026-06-14T00:00:00Z"));
  });
});

describe("day helpers", () => {
  it("fieldKey ignores case and spacing only", () => {
    expect(fieldKey("  Five  Acre Meadow ")).toBe("five acre meadow");
    expect(fieldKey("Five Acre Meadows")).not.toBe(fieldKey("Five Acre Meadow"));
  });
  it("dayBounds reads the date in UTC by default; dayLabel", () => {
    expect(dayBounds("2026-03-29")).toEqual({ startMs: at("2026-03-29T00:00:00Z"), endMs: at("2026-03-30T00:00:00Z") });
    expect(dayLabel("2026-07-04")).toBe("Sat 4 Jul 2026");
    expect(dayLabel("2027-03-13")).toBe("Sat 13 Mar 2027");
  });
});
