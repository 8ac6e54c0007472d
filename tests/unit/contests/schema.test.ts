import { describe, expect, it } from "vitest";
import { createContestSchema } from "@/lib/validations/contests";

const contest = (startsOn: string) => ({
  name: "Evening cup", startsOn, fieldName: "North strip", rounds: [{ letter: "A" }], maxGroupSize: 8, prepMinutes: 5, noFlySeconds: 60, dropRule: "none", practice: true,
});

describe("a contest's day (the one calendar-day schema)", () => {
  it("takes a real day and refuses one that does not exist or that the database cannot hold", () => {
    const ok = createContestSchema.safeParse(contest("2027-03-14"));
    expect(ok.error?.issues).toBeUndefined();
    for (const bad of ["2027-02-30", "0000-01-01", "9999-12-31", "14/03/2027"]) {
      const r = createContestSchema.safeParse(contest(bad));
      expect(r.success, bad).toBe(false);
      expect(r.error?.issues[0]?.path).toEqual(["startsOn"]);
    }
  });
});
