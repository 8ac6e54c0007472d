import { describe, expect, it } from "vitest";
import { finalResults, flyOffPlanProblems, rankPilots, reflightPlacements, roundTaskProblem, standingResult } from "@/lib/scoring";

// Preliminary: a first, b second, c third.
const preliminary = rankPilots([
  { pilotId: "a", rounds: [1000, 1000, 1000, 1000, 1000], penalties: 0 },
  { pilotId: "b", rounds: [990, 990, 990, 990, 990], penalties: 0 },
  { pilotId: "c", rounds: [900, 900, 900, 900, 900], penalties: 0 },
]);

describe("fly-off (F3K.10)", () => {
  it("is planned with 3 to 6 rounds", () => {
    expect(flyOffPlanProblems(2)).toEqual(["A fly-off has at least 3 rounds (F3K.10)."]);
    expect(flyOffPlanProblems(7)).toEqual(["A fly-off has at most 6 rounds (F3K.10)."]);
    expect([3, 4, 5, 6].map(flyOffPlanProblems)).toEqual([[], [], [], []]);
  });
  it("fewer than 3 completed rounds: the preliminary results stand", () => {
    // b won both fly-off rounds flown, but two rounds are not a fly-off.
    const r = finalResults(preliminary, [
      { pilotId: "a", rounds: [800, 800], penalties: 0 },
      { pilotId: "b", rounds: [1000, 1000], penalties: 0 },
    ]);
    expect(r.flyOffCounted).toBe(false);
    expect(r.places.map((p) => [p.pilotId, p.rank, p.stage])).toEqual([["a", 1, "preliminary"], ["b", 2, "preliminary"], ["c", 3, "preliminary"]]);
  });
  it("3 completed rounds: the fly-off decides the places of its pilots", () => {
    const r = finalResults(preliminary, [
      { pilotId: "a", rounds: [800, 800, 800], penalties: 0 },
      { pilotId: "b", rounds: [1000, 1000, 1000], penalties: 0 },
    ]);
    expect(r.flyOffCounted).toBe(true);
    expect(r.places.map((p) => [p.pilotId, p.rank, p.stage])).toEqual([["b", 1, "fly-off"], ["a", 2, "fly-off"], ["c", 3, "preliminary"]]);
  });
  it("a round only some fly-off pilots have flown does not count yet", () => {
    // Round 4 flown by a only (1000 vs nothing): a 3-round fly-off, b wins it 3000 to 2400.
    const r = finalResults(preliminary, [
      { pilotId: "a", rounds: [800, 800, 800, 1000], penalties: 0 },
      { pilotId: "b", rounds: [1000, 1000, 1000], penalties: 0 },
    ]);
    expect(r.places.slice(0, 2).map((p) => p.pilotId)).toEqual(["b", "a"]);
  });
  it("more than 6 fly-off rounds are refused", () => {
    expect(() => finalResults(preliminary, [{ pilotId: "a", rounds: Array(7).fill(1000), penalties: 0 }])).toThrow("at most 6 rounds");
  });
  it("task M only in fly-off rounds (F3K.10, F3K.11.13)", () => {
    expect(roundTaskProblem("M", "preliminary")).toMatch(/fly-off rounds only/);
    expect(roundTaskProblem("M", "fly-off")).toBeNull();
    expect(roundTaskProblem("H", "preliminary")).toBeNull();
  });
});

describe("re-flights (F3K.9.6)", () => {
  it("the placements in the rules' order of preference; a fly-off re-flies with its original group only", () => {
    expect(reflightPlacements("preliminary")).toEqual(["later-group", "new-group", "original-group"]);
    expect(reflightPlacements("fly-off")).toEqual(["original-group"]);
  });
  it("a new group of re-flyers or the original group at the end: the re-flight's result stands even if worse", () => {
    expect(standingResult({ original: 950, reflight: 800, placement: "new-group", entitled: true })).toEqual({ points: 800, stands: "reflight" });
    expect(standingResult({ original: 950, reflight: 800, placement: "original-group", entitled: true })).toEqual({ points: 800, stands: "reflight" });
  });
  it("the others of that group, flying again without a claim, keep the better of their two", () => {
    expect(standingResult({ original: 950, reflight: 800, placement: "original-group", entitled: false })).toEqual({ points: 950, stands: "original" });
    expect(standingResult({ original: 700, reflight: 800, placement: "new-group", entitled: false })).toEqual({ points: 800, stands: "reflight" });
  });
  it("ours: in a later group the re-flyer keeps the better of the two", () => {
    expect(standingResult({ original: 950, reflight: 800, placement: "later-group", entitled: true })).toEqual({ points: 950, stands: "original" });
    expect(standingResult({ original: 600, reflight: 800, placement: "later-group", entitled: true })).toEqual({ points: 800, stands: "reflight" });
  });
});
