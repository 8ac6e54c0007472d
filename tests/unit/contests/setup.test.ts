import { describe, expect, it } from "vitest";
import { checkSetup } from "@/lib/contests/setup";

const plan = (letters: string, more: Partial<Parameters<typeof checkSetup>[0]> = {}) => ({
  rounds: [...letters].map((letter) => ({ letter })), practice: false, prepMinutes: 5, noFlySeconds: 60, ...more,
});

describe("contest set-up against the rules", () => {
  it("accepts 5 rounds of different tasks (F3K.10)", () => {
    expect(checkSetup(plan("ABDFG"))).toEqual({ errors: [], warnings: [] });
  });
  it("refuses fewer than 5 rounds for a contest, warns for a practice event (F3K.10)", () => {
    expect(checkSetup(plan("ABDF")).errors).toEqual(["A valid contest has at least 5 rounds (F3K.10); this one has 4."]);
    const practice = checkSetup(plan("ABDF", { practice: true }));
    expect(practice.errors).toEqual([]);
    expect(practice.warnings).toHaveLength(1);
  });
  it("refuses a repeated task for a contest, warns for practice (F3K.10)", () => {
    expect(checkSetup(plan("ABDFA")).errors).toEqual(["Round 5 repeats task A of round 1; a valid contest flies a different task each round (F3K.10)."]);
    expect(checkSetup(plan("ABDFA", { practice: true })).errors).toEqual([]);
  });
  it("refuses task M outside a fly-off even for practice, accepts it in a fly-off (F3K.10, F3K.11)", () => {
    expect(checkSetup(plan("ABDFM", { practice: true })).errors).toEqual(["Round 5: task M is for fly-off rounds only (F3K.10)."]);
    const flyOff = [{ letter: "M", flyOff: true }, { letter: "A", flyOff: true }, { letter: "B", flyOff: true }];
    expect(checkSetup({ ...plan("ABDFG"), rounds: [...plan("ABDFG").rounds, ...flyOff] }).errors).toEqual([]);
  });
  it("a planned fly-off has 3 to 6 rounds, for practice too (F3K.10: \"Fly-off: 3–6 rounds\")", () => {
    const withFlyOff = (n: number) => ({ ...plan("ABDFG", { practice: true }), rounds: [...plan("ABDFG").rounds, ...Array.from({ length: n }, () => ({ letter: "A", flyOff: true }))] });
    expect(checkSetup(withFlyOff(2)).errors).toEqual(["A fly-off has at least 3 rounds (F3K.10)."]);
    expect(checkSetup(withFlyOff(3)).errors).toEqual([]);
    expect(checkSetup(withFlyOff(6)).errors).toEqual([]);
    expect(checkSetup(withFlyOff(7)).errors).toEqual(["A fly-off has at most 6 rounds (F3K.10)."]);
  });
  it("a planned fly-off says how many pilots fly it: 2 to 30 (RULES.md leaves the number to the organiser)", () => {
    const flyOff = ["M", "A", "B"].map((letter) => ({ letter, flyOff: true }));
    const withPilots = (flyOffPilots: number | null) => ({ ...plan("ABDFG"), rounds: [...plan("ABDFG").rounds, ...flyOff], flyOffPilots });
    expect(checkSetup(withPilots(5)).errors).toEqual([]);
    for (const bad of [null, 1, 31, 2.5]) expect(checkSetup(withPilots(bad)).errors, String(bad)).toEqual(["Give how many pilots fly the fly-off: 2 to 30."]);
    // no fly-off rounds: the number is not asked for
    expect(checkSetup({ ...plan("ABDFG"), flyOffPilots: null }).errors).toEqual([]);
  });
  it("checks preparation (at least 5 min) and the 60 s no-fly period (F3K.9)", () => {
    expect(checkSetup(plan("ABDFG", { prepMinutes: 3, noFlySeconds: 30 })).errors).toHaveLength(2);
    expect(checkSetup(plan("ABDFG", { prepMinutes: 3, practice: true })).warnings).toEqual(["Preparation time is at least 5 minutes (F3K.9)."]);
  });
});
