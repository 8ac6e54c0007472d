import { describe, expect, it } from "vitest";
import { finalStandings, rankFlyOff, rankPilots, rankTeams } from "@/lib/scoring";

describe("rankPilots (F3K.10)", () => {
  it("orders by total", () => {
    const s = rankPilots([
      { pilotId: "a", rounds: [900, 900, 900, 900, 900], penalties: 0 },
      { pilotId: "b", rounds: [1000, 1000, 1000, 1000, 1000], penalties: 0 },
    ]);
    expect(s.map((x) => [x.pilotId, x.rank])).toEqual([["b", 1], ["a", 2]]);
  });
  it("equal totals: the better dropped score ranks higher", () => {
    // a: 5 × 1000 + 600, drops 600 → 5000; b: 5 × 1000 + 800, drops 800 → 5000. b's drop is better.
    const s = rankPilots([
      { pilotId: "a", rounds: [1000, 1000, 1000, 1000, 1000, 600], penalties: 0 },
      { pilotId: "b", rounds: [1000, 1000, 1000, 1000, 800, 1000], penalties: 0 },
    ]);
    expect(s.map((x) => [x.pilotId, x.rank, x.unresolvedTie])).toEqual([["b", 1, false], ["a", 2, false]]);
  });
  it("still tied: same place, flagged for a fly-off", () => {
    const s = rankPilots([
      { pilotId: "a", rounds: [1000, 900, 900, 900, 900, 500], penalties: 0 },
      { pilotId: "b", rounds: [900, 1000, 900, 900, 900, 500], penalties: 0 },
      { pilotId: "c", rounds: [100, 100, 100, 100, 100, 100], penalties: 0 },
    ]);
    expect(s.map((x) => [x.pilotId, x.rank, x.unresolvedTie])).toEqual([["a", 1, true], ["b", 1, true], ["c", 3, false]]);
  });
  it("penalties count against the total", () => {
    const s = rankPilots([
      { pilotId: "a", rounds: [1000, 1000, 1000, 1000, 1000], penalties: 100 },
      { pilotId: "b", rounds: [1000, 1000, 1000, 1000, 950], penalties: 0 },
    ]);
    expect(s.map((x) => [x.pilotId, x.total])).toEqual([["b", 4950], ["a", 4900]]);
  });
});

describe("fly-off and final standings", () => {
  it("fly-off standings use only fly-off rounds, with no drop by default", () => {
    const fo = rankFlyOff([
      { pilotId: "b", rounds: [1000, 800, 1000], penalties: 0 },
      { pilotId: "a", rounds: [900, 1000, 950], penalties: 0 },
    ]);
    expect(fo.map((x) => [x.pilotId, x.total])).toEqual([["a", 2850], ["b", 2800]]);
    expect(fo.every((x) => x.dropped === null)).toBe(true);
  });
  it("fly-off pilots take the top places; the others follow in preliminary order", () => {
    const prelim = rankPilots([
      { pilotId: "a", rounds: [1000, 1000, 1000, 1000, 1000], penalties: 0 },
      { pilotId: "b", rounds: [990, 990, 990, 990, 990], penalties: 0 },
      { pilotId: "c", rounds: [980, 980, 980, 980, 980], penalties: 0 },
      { pilotId: "d", rounds: [970, 970, 970, 970, 970], penalties: 0 },
    ]);
    const fo = rankFlyOff([
      { pilotId: "a", rounds: [900, 900, 900], penalties: 0 },
      { pilotId: "b", rounds: [1000, 1000, 1000], penalties: 0 },
    ]);
    expect(finalStandings(prelim, fo)).toEqual([
      { pilotId: "b", rank: 1, stage: "fly-off" },
      { pilotId: "a", rank: 2, stage: "fly-off" },
      { pilotId: "c", rank: 3, stage: "preliminary" },
      { pilotId: "d", rank: 4, stage: "preliminary" },
    ]);
  });
});

describe("rankTeams (F3K.10.4)", () => {
  it("sums the three best members' final scores", () => {
    const standings = [
      { pilotId: "a1", totalTenths: 50000 },
      { pilotId: "a2", totalTenths: 40000 },
      { pilotId: "a3", totalTenths: 30000 },
      { pilotId: "a4", totalTenths: 45000 },
      { pilotId: "b1", totalTenths: 49000 },
      { pilotId: "b2", totalTenths: 48000 },
      { pilotId: "b3", totalTenths: 10000 },
    ];
    const t = rankTeams(
      [
        { teamId: "A", memberIds: ["a1", "a2", "a3", "a4"] },
        { teamId: "B", memberIds: ["b1", "b2", "b3"] },
      ],
      standings,
    );
    // A: 5000 + 4500 + 4000 = 13500; B: 4900 + 4800 + 1000 = 10700
    expect(t.map((x) => [x.teamId, x.rank, x.total])).toEqual([["A", 1, 13500], ["B", 2, 10700]]);
    expect(t[0]?.countedMemberIds).toEqual(["a1", "a4", "a2"]);
  });
});
