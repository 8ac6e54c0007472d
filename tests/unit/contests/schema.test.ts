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

describe("a planned fly-off in the set-up (F3K.10: \"Fly-off: 3–6 rounds\"; how many qualify is the organiser's choice)", () => {
  const withFlyOff = (more: Record<string, unknown>) => ({ ...contest("2027-03-14"), ...more });
  const messages = (x: unknown) => createContestSchema.safeParse(x).error?.issues.map((i) => i.message) ?? [];
  it("takes fly-off rounds with their tasks (M included) and the number of pilots; none by default", () => {
    const r = createContestSchema.parse(withFlyOff({ flyOffRounds: [{ letter: "M" }, { letter: "A" }, { letter: "B" }], flyOffPilots: 6 }));
    expect(r.flyOffRounds.map((x) => x.letter)).toEqual(["M", "A", "B"]);
    expect(r.flyOffPilots).toBe(6);
    expect(createContestSchema.parse(contest("2027-03-14"))).toMatchObject({ flyOffRounds: [], flyOffPilots: null });
  });
  it("refuses with a sentence: rounds without pilots, pilots without rounds, more than 6 rounds, 1 or 31 pilots, a fraction", () => {
    expect(messages(withFlyOff({ flyOffRounds: [{ letter: "A" }, { letter: "B" }, { letter: "C" }] }))).toEqual(["Give how many pilots fly the fly-off."]);
    expect(messages(withFlyOff({ flyOffPilots: 5 }))).toEqual(["Plan the fly-off's rounds (3 to 6, F3K.10), or leave the number of fly-off pilots empty."]);
    expect(messages(withFlyOff({ flyOffRounds: Array.from({ length: 7 }, () => ({ letter: "A" })), flyOffPilots: 5 }))).toEqual(["A fly-off has at most 6 rounds (F3K.10)."]);
    expect(messages(withFlyOff({ flyOffRounds: [{ letter: "A" }], flyOffPilots: 1 }))).toEqual(["At least 2 pilots fly a fly-off."]);
    expect(messages(withFlyOff({ flyOffRounds: [{ letter: "A" }], flyOffPilots: 31 }))).toEqual(["At most 30 pilots fly a fly-off (one group)."]);
    expect(messages(withFlyOff({ flyOffRounds: [{ letter: "A" }], flyOffPilots: 4.5 }))).toEqual(["Give a whole number of pilots for the fly-off."]);
    expect(messages(withFlyOff({ flyOffRounds: [{ letter: "Z" }], flyOffPilots: 4 }))).toHaveLength(1);
  });
});
