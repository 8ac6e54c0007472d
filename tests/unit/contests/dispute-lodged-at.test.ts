import { describe, expect, it } from "vitest";
import { lodgedAtProblem } from "@/lib/contests/disputes";

/** When a dispute was lodged, as the officer enters it: not in the future, at most 2 days before the contest's day (our choice, DEVELOPERS.md). */
describe("lodgedAtProblem", () => {
  const now = new Date("2027-03-13T15:00:00Z");
  it("accepts now, a minute's clock allowance, and the 2 days before the contest's day", () => {
    expect(lodgedAtProblem(now, now, "2027-03-13")).toBeNull();
    expect(lodgedAtProblem(new Date("2027-03-13T15:00:59Z"), now, "2027-03-13")).toBeNull();
    expect(lodgedAtProblem(new Date("2027-03-11T00:00:00Z"), now, "2027-03-13")).toBeNull();
  });
  it("refuses the future and earlier than 2 days before", () => {
    expect(lodgedAtProblem(new Date("2027-03-13T15:02:00Z"), now, "2027-03-13")).toMatch(/future/);
    expect(lodgedAtProblem(new Date("2027-03-10T23:59:59Z"), now, "2027-03-13")).toMatch(/2 days/);
  });
});
