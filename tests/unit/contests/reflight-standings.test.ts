import { describe, expect, it } from "vitest";
import { contestStandings, type StandingsReflight, type StandingsSlot } from "@/lib/contests/standings";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

/**
 * Re-flights in the standings (lib/contests/standings.ts through lib/scoring/reflight.ts
 * standingResult), every number computed by hand in the comments from RULES.md "Re-flights"
 * (F3K.9.6, F3K.4.2): flown in a later group the re-flyer keeps the better of the two results
 * (our reading: the rules say "even if worse" only of the other two placements); in a new group or
 * with the original group at the end of the round the re-flight stands even if worse, and the group
 * mates flying again keep the better of their two. Group normalisation: F3K.9.1; unsigned = zero: F3K.1.2.
 * Task A (last flight, 300 s cap).
 */
const A = getCatalogueTask("A");
const rounds = [{ id: "r1", number: 1, isFlyOff: false, task: A }];
const entries = ["P1", "P2", "P3", "P4"].map((id) => ({ id, name: `Pilot ${id}`, team: null, withdrawn: false }));
const slot = (entryId: string, group: number, tenths: number, reflight: Partial<StandingsReflight> | null = null): StandingsSlot => ({
  roundId: "r1", groupNumber: group, entryId, runResultTenths: tenths, paperFlights: null, signed: true, penaltyPoints: 0,
  reflight: reflight && { placement: "later-group", entitled: true, groupNumber: group, runResultTenths: null, paperFlights: null, signed: true, ...reflight },
});
const cell = (s: ReturnType<typeof contestStandings>, id: string) => s.pilots.find((p) => p.entryId === id)!.rounds[0]!;

describe("re-flights in the standings (F3K.9.6)", () => {
  it("a later group: the re-flyer keeps the better result, normalised in the group it was flown in", () => {
    // Group 1: P1 100.0 s (hit by an outsider, re-flight granted), P2 200.0 s.
    // Group 2: P3 250.0 s, P4 200.0 s; P1 re-flies there: 240.0 s, better than 100.0 → it stands, in group 2.
    // Group 1 is then P2 alone: 1000.0. Group 2: P3 1000.0, P1 240/250 = 960.0, P4 200/250 = 800.0.
    const s = contestStandings({
      rounds, entries, dropRule: "f3k",
      slots: [slot("P1", 1, 1000, { groupNumber: 2, runResultTenths: 2400 }), slot("P2", 1, 2000), slot("P3", 2, 2500), slot("P4", 2, 2000)],
    });
    expect(cell(s, "P1")).toMatchObject({ groupNumber: 2, resultTenths: 2400, pointsTenths: 9600, reflight: { stands: "reflight", originalTenths: 1000, reflightTenths: 2400 } });
    expect(cell(s, "P2").pointsTenths).toBe(10000);
    expect(cell(s, "P4").pointsTenths).toBe(8000);
  });

  it("a later group and a worse re-flight: the first result stands, in its own group", () => {
    // P1 200.0 s in group 1 with P2 250.0 s; the re-flight in group 2 gives 50.0 s → 200.0 stands: 200/250 = 800.0.
    const s = contestStandings({
      rounds, entries: entries.slice(0, 3), dropRule: "f3k",
      slots: [slot("P1", 1, 2000, { groupNumber: 2, paperFlights: [500] }), slot("P2", 1, 2500), slot("P3", 2, 3000)],
    });
    expect(cell(s, "P1")).toMatchObject({ groupNumber: 1, resultTenths: 2000, pointsTenths: 8000, reflight: { stands: "original", reflightTenths: 500 } });
  });

  it("the original group at the end of the round: the re-flyer's re-flight stands even if worse; a group mate keeps the better", () => {
    // P1 entitled: 250.0 then 150.0 → 150.0 stands. P2 (flies again, not entitled): 200.0 then 100.0 → keeps 200.0.
    // Group 1 best is P2's 200.0 → P2 1000.0, P1 150/200 = 750.0.
    const s = contestStandings({
      rounds, entries: entries.slice(0, 2), dropRule: "f3k",
      slots: [
        slot("P1", 1, 2500, { placement: "original-group", runResultTenths: 1500 }),
        slot("P2", 1, 2000, { placement: "original-group", entitled: false, runResultTenths: 1000 }),
      ],
    });
    expect(cell(s, "P1")).toMatchObject({ resultTenths: 1500, pointsTenths: 7500, reflight: { stands: "reflight" } });
    expect(cell(s, "P2")).toMatchObject({ resultTenths: 2000, pointsTenths: 10000, reflight: { stands: "original" } });
  });

  it("a new group: the re-flight stands even if worse", () => {
    // P1 280.0 s in group 1 (with P2 140.0 s); re-flies in new group 3 with P3: 210.0 s vs P3 300.0 s.
    // P1's 210.0 stands in group 3: 210/300 = 700.0; group 1 is P2 alone: 1000.0.
    const s = contestStandings({
      rounds, entries: entries.slice(0, 3), dropRule: "f3k",
      slots: [slot("P1", 1, 2800, { placement: "new-group", groupNumber: 3, runResultTenths: 2100 }), slot("P2", 1, 1400), slot("P3", 3, 3000)],
    });
    expect(cell(s, "P1")).toMatchObject({ groupNumber: 3, resultTenths: 2100, pointsTenths: 7000 });
    expect(cell(s, "P2").pointsTenths).toBe(10000);
  });

  it("a re-flight not yet flown leaves the first result; an unsigned re-flight counts zero (F3K.1.2)", () => {
    const waiting = contestStandings({ rounds, entries: entries.slice(0, 2), dropRule: "f3k", slots: [slot("P1", 1, 1000, {}), slot("P2", 1, 2000)] });
    expect(cell(waiting, "P1")).toMatchObject({ resultTenths: 1000, pointsTenths: 5000, reflight: null });
    // original group, entitled, unsigned 250.0 s: it stands and scores zero
    const unsigned = contestStandings({
      rounds, entries: entries.slice(0, 2), dropRule: "f3k",
      slots: [slot("P1", 1, 1000, { placement: "original-group", runResultTenths: 2500, signed: false }), slot("P2", 1, 2000)],
    });
    expect(cell(unsigned, "P1")).toMatchObject({ signed: false, pointsTenths: 0, reflight: { stands: "reflight", reflightTenths: 0 } });
  });
});
