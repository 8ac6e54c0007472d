import { describe, expect, it } from "vitest";
import { choices, filtersQuery, matchesFilters, readFilters, type FilterableRun } from "@/lib/field/logbook-filter";

const run = (patch: Partial<FilterableRun> = {}): FilterableRun => ({ sessionId: "s1", field: "Long Meadow", day: "2026-06-20", pilots: ["Kit Marsh", "Sol Ardent"], taskKey: "B", ...patch });
const none = readFilters(new URLSearchParams(""));

describe("logbook filters in the address (issue #10: shareable filtered views)", () => {
  it("round-trips through the query string, leaving empty ones out", () => {
    const f = readFilters(new URLSearchParams("pilot=Kit+Marsh&task=B&from=2026-06-10"));
    expect(f).toEqual({ pilot: "Kit Marsh", task: "B", field: "", from: "2026-06-10", to: "", session: "" });
    expect(filtersQuery(f)).toBe("pilot=Kit+Marsh&task=B&from=2026-06-10");
  });
  it("ignores a date that is not YYYY-MM-DD instead of hiding everything", () => {
    expect(readFilters(new URLSearchParams("from=yesterday&to=2026-13")).from).toBe("");
  });
  it("matches each filter on its own and all together", () => {
    expect(matchesFilters(run(), none)).toBe(true);
    expect(matchesFilters(run(), { ...none, pilot: " sol ardent " })).toBe(true);
    expect(matchesFilters(run(), { ...none, pilot: "Rowan Vale" })).toBe(false);
    expect(matchesFilters(run(), { ...none, task: "H" })).toBe(false);
    expect(matchesFilters(run(), { ...none, field: "long meadow" })).toBe(true);
    expect(matchesFilters(run(), { ...none, field: "Quarry Field" })).toBe(false);
    expect(matchesFilters(run(), { ...none, session: "s2" })).toBe(false);
  });
  it("keeps the date range inclusive at both ends", () => {
    expect(matchesFilters(run(), { ...none, from: "2026-06-20", to: "2026-06-20" })).toBe(true);
    expect(matchesFilters(run(), { ...none, from: "2026-06-21" })).toBe(false);
    expect(matchesFilters(run(), { ...none, to: "2026-06-19" })).toBe(false);
  });
  it("offers each choice once, sorted", () => {
    expect(choices(["Kit", "Ada", " Kit ", ""])).toEqual(["Ada", "Kit"]);
  });
});
