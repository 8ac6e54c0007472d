import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { RUN_COLUMNS, isoWithOffset, runCells, seconds, toCsv } from "@/lib/season/csv";
import { seasonFiltersQuery, seasonFiltersSchema, seasonRunsQuerySchema } from "@/lib/validations/season";

describe("season filters", () => {
  it("reads the address's filters, leaving empty ones out and defaulting to practice and contest", () => {
    expect(seasonFiltersSchema.parse({ from: "2026-06-01", to: "", task: "H", field: "", kind: "" })).toEqual({ from: "2026-06-01", task: "H", kind: "all" });
  });

  it("refuses a day that is not on the calendar, a task that is not a letter, a page size it does not offer", () => {
    expect(seasonFiltersSchema.safeParse({ from: "2026-02-30" }).success).toBe(false);
    expect(seasonFiltersSchema.safeParse({ from: "2028-02-29" }).success).toBe(true);
    expect(seasonFiltersSchema.safeParse({ task: "Z" }).success).toBe(false);
    expect(seasonRunsQuerySchema.safeParse({ size: "30" }).success).toBe(false);
    expect(seasonRunsQuerySchema.parse({ size: "50", page: "2" })).toMatchObject({ size: 50, page: 2, sort: "date", dir: "desc" });
  });

  it("refuses a day the database cannot hold as an instant (year 0000; 9999-12-31, whose next day has five digits) instead of failing the query", () => {
    // PostgreSQL refuses '0000-01-01T00:00:00.000Z'::timestamptz, and JavaScript writes the day after 9999-12-31 as "+010000-01-01…"
    for (const day of ["0000-01-01", "9999-12-31", "1999-12-31"]) {
      expect(seasonFiltersSchema.safeParse({ from: day }).success).toBe(false);
      expect(seasonFiltersSchema.safeParse({ to: day }).success).toBe(false);
    }
    expect(seasonFiltersSchema.safeParse({ from: "2000-01-01", to: "2999-12-31" }).success).toBe(true);
  });

  it("writes the same query string for the same filters, whatever their order", () => {
    expect(seasonFiltersQuery({ task: "H", from: "2026-06-01", kind: "all", field: "" })).toBe("from=2026-06-01&task=H");
    expect(seasonFiltersQuery({ from: "2026-06-01", task: "H" })).toBe("from=2026-06-01&task=H");
  });
});

describe("season CSV", () => {
  it("writes seconds with one decimal and instants with their offset", () => {
    expect([seconds(24), seconds(1600), seconds(null)]).toEqual(["2.4", "160.0", ""]);
    expect(isoWithOffset("2026-06-02T10:00:00.000Z")).toBe("2026-06-02T10:00:00.000+00:00");
  });

  it("quotes what needs quoting and defuses a field name a spreadsheet would run as a formula", () => {
    const row = runCells({
      runId: "r1", lane: 0, at: "2026-06-02T10:00:00.000Z", field: "=HYPERLINK(\"x\")", task: "H", resultTenths: 1600, maxTenths: 1800,
      share: 1600 / 1800, flights: 3, lostTenths: 200, penaltyPoints: 0, contest: false,
    });
    const parsed = Papa.parse<string[]>(toCsv(RUN_COLUMNS, [row]), { skipEmptyLines: true }).data;
    expect(parsed).toEqual([[...RUN_COLUMNS], ["r1", "0", "2026-06-02T10:00:00.000+00:00", "'=HYPERLINK(\"x\")", "H", "160.0", "180.0", "0.8889", "3", "20.0", "0", "practice"]]);
  });
});
