import { describe, expect, it } from "vitest";
import { describeAge } from "@/app/(app)/season/_components/data-age";
import { exportHref, seasonKeys } from "@/app/(app)/season/_components/season-queries";
import { tableQuery } from "@/app/(app)/season/_components/season-table";

describe("Season screen helpers", () => {
  it("says how old the last figures are", () => {
    expect([describeAge(20_000), describeAge(60_000), describeAge(5 * 60_000), describeAge(3 * 3600_000), describeAge(3 * 86_400_000)]).toEqual([
      "less than a minute ago", "1 minute ago", "5 minutes ago", "3 hours ago", "3 days ago",
    ]);
  });

  it("asks the server for the page's filters plus the table's sort and 1-based page", () => {
    expect(tableQuery("from=2026-06-01&task=H", [{ id: "result", desc: false }], { pageIndex: 2, pageSize: 25 })).toBe(
      "from=2026-06-01&task=H&sort=result&dir=asc&page=3&size=25",
    );
  });

  it("keys each filter apart and builds the export address", () => {
    expect(seasonKeys.summary("p1", "task=H")).not.toEqual(seasonKeys.summary("p1", "task=G"));
    expect(exportHref("p1", "runs", "task=H")).toBe("/api/pilots/p1/season/export?task=H&what=runs");
    expect(exportHref("p1", "flights", "")).toBe("/api/pilots/p1/season/export?what=flights");
  });
});
