import { describe, expect, it } from "vitest";
import { contestStandings, type StandingsInput, type StandingsSlot } from "@/lib/contests/standings";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

/**
 * Contest standings from slots (lib/contests/standings.ts), every expected number computed by hand
 * in the comments from RULES.md "Scoring across pilots" (F3K.9.1, F3K.10, F3K.10.1, F3K.10.2,
 * F3K.10.4) and "Penalties" (F3K.1.2). Task A (last flight, 300 s cap) throughout.
 */
const A = getCatalogueTask("A");
const rounds = (n: number, flyOff = 0) => [
  ...Array.from({ length: n }, (_, i) => ({ id: `r${i + 1}`, number: i + 1, isFlyOff: false, task: A })),
  ...Array.from({ length: flyOff }, (_, i) => ({ id: `f${i + 1}`, number: i + 1, isFlyOff: true, task: A })),
];
const entry = (id: string, team: string | null = null) => ({ id, name: `Pilot ${id}`, team, withdrawn: false });
/** A signed run result (tenths) for one pilot in one round's group. */
const run = (roundId: string, entryId: string, tenths: number, more: Partial<StandingsSlot> = {}): StandingsSlot => ({
  roundId, groupNumber: 1, entryId, runResultTenths: tenths, paperFlights: null, signed: true, penaltyPoints: 0, ...more,
});
/** One group, each pilot's results per round (tenths), round i = index i. */
const series = (byPilot: Record<string, number[]>, group = 1): StandingsSlot[] =>
  Object.entries(byPilot).flatMap(([id, results]) => results.map((t, i) => run(`r${i + 1}`, id, t, { groupNumber: group })));
const row = (s: ReturnType<typeof contestStandings>, id: string) => s.pilots.find((p) => p.entryId === id)!;

describe("contestStandings", () => {
  it("normalises each group on its own best, paper cards scored by the task engine (F3K.9.1)", () => {
    // Group 1: P1's card 120.0 then 150.0 → task A counts the last: 150.0 s; P2 180.0 s (best) → P1 150/180 × 1000 = 833.33 → 833.3.
    // Group 2: P3's 350.0 s is capped at 300.0 s (best, 1000); P4 240/300 × 1000 = 800.0.
    const paper = (entryId: string, group: number, flights: number[]): StandingsSlot => ({ ...run("r1", entryId, 0, { groupNumber: group }), runResultTenths: null, paperFlights: flights });
    const s = contestStandings({
      rounds: rounds(1), entries: ["1", "2", "3", "4"].map((id) => entry(id)), dropRule: "f3k",
      slots: [paper("1", 1, [1200, 1500]), paper("2", 1, [1800]), paper("3", 2, [3500]), paper("4", 2, [2400])],
    });
    expect(s.pilots.map((p) => [p.entryId, p.rounds[0]!.resultTenths, p.rounds[0]!.pointsTenths])).toEqual([
      ["2", 1800, 10000], ["3", 3000, 10000], ["1", 1500, 8333], ["4", 2400, 8000],
    ]);
    expect(s.pilots[0]!.rounds[0]!.source).toBe("paper");
    expect(s.valid).toBe(false); // one round: not a valid contest yet (F3K.10: at least 5)
  });

  it("drops the lowest round from 6 flown and subtracts a penalty given in the dropped round (F3K.10.1)", () => {
    // P1 points: 1000, 500, 1000, 1000, 1000, 800 = 5300; drop round 2 (500) → 4800; its 100-point penalty stays → 4700.0.
    // P2 points: 500, 1000, 666.7 (200/300), 1000, 900, 1000 = 5066.7; drop round 1 (500) → 4566.7.
    const slots = series({ P1: [3000, 1500, 3000, 3000, 3000, 2400], P2: [1500, 3000, 2000, 3000, 2700, 3000] });
    slots.find((x) => x.entryId === "P1" && x.roundId === "r2")!.penaltyPoints = 100;
    const s = contestStandings({ rounds: rounds(6), entries: [entry("P1"), entry("P2")], slots, dropRule: "f3k" });
    expect(row(s, "P1")).toMatchObject({ rank: 1, totalTenths: 47000, keptTenths: 48000, penaltyTenths: 1000, dropped: { index: 1, tenths: 5000 } });
    expect(row(s, "P1").rounds[1]!.dropped).toBe(true);
    expect(row(s, "P2")).toMatchObject({ rank: 2, totalTenths: 45667, dropped: { index: 0 } });
    expect(s.valid).toBe(true);
    // "every round counts": P1 5300 − 100 = 5200.0, P2 5066.7
    const none = contestStandings({ rounds: rounds(6), entries: [entry("P1"), entry("P2")], slots, dropRule: "none" });
    expect([row(none, "P1").totalTenths, row(none, "P2").totalTenths]).toEqual([52000, 50667]);
  });

  it("an unsigned result scores zero and is nobody's best (F3K.1.2)", () => {
    // P2's 300.0 s is unsigned: P2 scores 0 and P1's 240.0 s is the group's best → 1000.
    const s = contestStandings({
      rounds: rounds(1), entries: [entry("P1"), entry("P2")], dropRule: "f3k",
      slots: [run("r1", "P1", 2400), run("r1", "P2", 3000, { signed: false })],
    });
    expect(row(s, "P1").rounds[0]).toMatchObject({ pointsTenths: 10000, signed: true });
    expect(row(s, "P2").rounds[0]).toMatchObject({ resultTenths: 3000, pointsTenths: 0, signed: false });
  });

  // Rounds 1–5: A, B and D fly 300.0 s (1000 each), C 150.0 s (500). Round 6: C 300.0 s (1000),
  // A 180.0 s (600), B and D 120.0 s (400). Totals after the drop: A 5000 (dropped 600), B and D 5000
  // (dropped 400), C 5×500 + 1000 − 500 = 3000.
  const tie = series({ A: [3000, 3000, 3000, 3000, 3000, 1800], B: [3000, 3000, 3000, 3000, 3000, 1200], C: [1500, 1500, 1500, 1500, 1500, 3000], D: [3000, 3000, 3000, 3000, 3000, 1200] });

  it("equal totals: the better dropped score ranks higher; still equal shares the place, flagged for a fly-off (F3K.10.2)", () => {
    const s = contestStandings({ rounds: rounds(6), entries: ["A", "B", "C", "D"].map((id) => entry(id)), slots: tie, dropRule: "f3k" });
    expect(s.pilots.map((p) => [p.entryId, p.totalTenths, p.rank, p.unresolvedTie])).toEqual([
      ["A", 50000, 1, false], ["B", 50000, 2, true], ["D", 50000, 2, true], ["C", 30000, 4, false],
    ]);
    expect(s.final.map((f) => [f.pilotId, f.rank])).toEqual([["A", 1], ["B", 2], ["D", 2], ["C", 4]]);
  });

  it("juniors are ranked among themselves from the final order; a tie stays a tie (common practice: a junior ranking beside the contest's)", () => {
    // the tie example above: A 1st, B and D 2nd equal, C 4th; B, C and D fly as juniors → B and D 1st equal, C 3rd
    const entries = ["A", "B", "C", "D"].map((id) => ({ ...entry(id), pilotClass: id === "A" ? ("senior" as const) : ("junior" as const) }));
    const s = contestStandings({ rounds: rounds(6), entries, slots: tie, dropRule: "f3k" });
    expect(s.juniors.map((j) => [j.entryId, j.rank, j.overallRank, j.name])).toEqual([["B", 1, 2, "Pilot B"], ["D", 1, 2, "Pilot D"], ["C", 3, 4, "Pilot C"]]);
    expect(contestStandings({ rounds: rounds(6), entries: entries.map((e) => ({ ...e, pilotClass: "senior" as const })), slots: tie, dropRule: "f3k" }).juniors).toEqual([]);
  });

  it("the contest's rounding of halves applies where the round's task does not say (README: half-up by default)", () => {
    // Round results (tenths, as the runs' server results give them): P1 400.0 s (best), P2 100.1 s.
    // P2's points in tenths = 1001 × 10000 / 4000 = 2502.5, an exact half → half-up 2503, half-even 2502, down 2502.
    const slots = [run("r1", "1", 4000), run("r1", "2", 1001)];
    const points = (halves?: "half-up" | "half-even" | "down") =>
      contestStandings({ rounds: rounds(1), entries: [entry("1"), entry("2")], slots, dropRule: "f3k", halves }).pilots.find((p) => p.entryId === "2")!.rounds[0]!.pointsTenths;
    expect([points(), points("half-up"), points("half-even"), points("down")]).toEqual([2503, 2503, 2502, 2502]);
  });

  it("teams rank by the sum of their three best members' final scores (F3K.10.4)", () => {
    // Kestrel = A, B, C, D: best three A + B + D = 15000 (C's 3000 left out). Swift = E alone in group 2:
    // 1000 in each of 6 rounds, one dropped → 5000.
    const slots = [...tie, ...series({ E: [2000, 2000, 2000, 2000, 2000, 2000] }, 2)];
    const s = contestStandings({
      rounds: rounds(6), dropRule: "f3k", slots,
      entries: [entry("A", "Kestrel"), entry("B", "Kestrel"), entry("C", "Kestrel"), entry("D", "Kestrel"), entry("E", "Swift")],
    });
    expect(s.teams).toEqual([
      { team: "Kestrel", rank: 1, totalTenths: 150000, counted: ["Pilot A", "Pilot B", "Pilot D"] },
      { team: "Swift", rank: 2, totalTenths: 50000, counted: ["Pilot E"] },
    ]);
  });

  it("a fly-off of 3 rounds decides the top places; preliminary points and penalties do not carry (F3K.10)", () => {
    // Preliminary (5 rounds, no drop): X 5000, Y 4500 − 100 penalty = 4400, Z 2500. X and Y fly off;
    // fly-off rounds: Y 300.0 s each (1000), X 270.0 s (900): Y 3000 (its penalty does not carry), X 2700.
    const prelim = series({ X: [3000, 3000, 3000, 3000, 3000], Y: [2700, 2700, 2700, 2700, 2700], Z: [1500, 1500, 1500, 1500, 1500] });
    prelim.find((x) => x.entryId === "Y")!.penaltyPoints = 100;
    const fly = (n: number) => ["f1", "f2", "f3"].slice(0, n).flatMap((r) => [run(r, "X", 2700), run(r, "Y", 3000)]);
    const input: StandingsInput = { rounds: rounds(5, 3), entries: ["X", "Y", "Z"].map((id) => entry(id)), slots: [...prelim, ...fly(3)], dropRule: "f3k" };
    const s = contestStandings(input);
    expect(s.pilots.map((p) => [p.entryId, p.totalTenths])).toEqual([["X", 50000], ["Y", 44000], ["Z", 25000]]);
    expect(s.flyOff!.counted).toBe(true);
    expect(s.flyOff!.pilots.map((p) => [p.entryId, p.totalTenths])).toEqual([["Y", 30000], ["X", 27000]]);
    expect(s.final.map((f) => [f.pilotId, f.rank, f.stage])).toEqual([["Y", 1, "fly-off"], ["X", 2, "fly-off"], ["Z", 3, "preliminary"]]);
    // Only 2 fly-off rounds complete: fewer than 3, the preliminary order stands.
    const early = contestStandings({ ...input, slots: [...prelim, ...fly(2)] });
    expect(early.flyOff!.counted).toBe(false);
    expect(early.final.map((f) => f.pilotId)).toEqual(["X", "Y", "Z"]);
  });

  it("live: a round counts once it has a result; a pilot not recorded yet has no points there (0 in the total)", () => {
    const s = contestStandings({
      rounds: rounds(3), entries: [entry("P1"), entry("P2")], dropRule: "f3k",
      slots: [run("r1", "P1", 3000), run("r1", "P2", 1500), run("r2", "P1", 3000), { ...run("r2", "P2", 0), runResultTenths: null }, { ...run("r3", "P1", 0), runResultTenths: null }],
    });
    expect(s.rounds.map((r) => r.number)).toEqual([1, 2]);
    expect(row(s, "P2").rounds.map((c) => c.pointsTenths)).toEqual([5000, null]);
    expect(row(s, "P1").totalTenths).toBe(20000);
  });
});
