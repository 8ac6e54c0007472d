import { describe, expect, it } from "vitest";
import { contestStandings, type StandingsSlot } from "@/lib/contests/standings";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

/**
 * Penalties given on the timekeeper's phone reach the standings through the linked run's result
 * (`runPenaltyPoints`: run_lanes.derived, where lib/results runResult already applied F3K.4.3 — only
 * the highest per attempt, none for a mid-air collision — and F3K.4.1). Numbers by hand from RULES.md
 * "Scoring across pilots" (F3K.9.1, F3K.10: penalties subtracted from the final score, even in the
 * dropped round, F3K.10.1 in standings.test.ts's naming) and "Penalties". Task A (last flight).
 */
const A = getCatalogueTask("A");
const rounds = Array.from({ length: 6 }, (_, i) => ({ id: `r${i + 1}`, number: i + 1, isFlyOff: false, task: A }));
const entries = ["P1", "P2"].map((id) => ({ id, name: `Pilot ${id}`, team: null, withdrawn: false }));
const run = (roundId: string, entryId: string, tenths: number, more: Partial<StandingsSlot> = {}): StandingsSlot => ({
  roundId, groupNumber: 1, entryId, runResultTenths: tenths, paperFlights: null, signed: true, penaltyPoints: 0, ...more,
});
const row = (s: ReturnType<typeof contestStandings>, id: string) => s.pilots.find((p) => p.entryId === id)!;

describe("phone penalties in the standings", () => {
  it("a phone penalty in the dropped round still comes off the total (F3K.10.1), beside a card's", () => {
    // P1: 300, 150, 300, 300, 300, 240 s vs P2 always 300 s → points 1000, 500, 1000, 1000, 1000, 800 = 5300; round 2 (500) dropped → 4800.
    // The phone gave 100 in round 2 (the dropped one, F3K.4.3 object in a safety area) and the officer's card 100 in round 6: 4800 − 200 = 4600.0.
    const slots = [1, 2, 3, 4, 5, 6].flatMap((n) => [
      run(`r${n}`, "P1", [3000, 1500, 3000, 3000, 3000, 2400][n - 1]!, { runPenaltyPoints: n === 2 ? 100 : 0, penaltyPoints: n === 6 ? 100 : 0 }),
      run(`r${n}`, "P2", 3000),
    ]);
    const s = contestStandings({ rounds, entries, slots, dropRule: "f3k" });
    expect(row(s, "P1")).toMatchObject({ totalTenths: 46000, penaltyTenths: 2000, dropped: { index: 1 } });
    expect(row(s, "P1").rounds[1]).toMatchObject({ penaltyPoints: 100, phonePenaltyPoints: 100, dropped: true });
    expect(row(s, "P1").rounds[5]).toMatchObject({ penaltyPoints: 100, phonePenaltyPoints: 0 });
    // before: the phone's 100 was not counted and the total was 4700.0
    expect(row(s, "P1").totalTenths).not.toBe(47000);
  });

  it("a paper card with flights outranks the run: the run's phone penalty no longer counts", () => {
    // P1's card says 200.0 s (task A): the card is the record, not the run (and its penalty); P2 300.0 s → 666.7, no penalty.
    const s = contestStandings({
      rounds: rounds.slice(0, 1), entries, dropRule: "f3k",
      slots: [run("r1", "P1", 2800, { paperFlights: [2000], runPenaltyPoints: 300 }), run("r1", "P2", 3000)],
    });
    expect(row(s, "P1")).toMatchObject({ totalTenths: 6667, penaltyTenths: 0 });
    expect(row(s, "P1").rounds[0]).toMatchObject({ source: "paper", phonePenaltyPoints: 0 });
  });

  it("a re-flight's run brings its own phone penalty; the first flight's stays (our reading, as a dropped round's does, F3K.10)", () => {
    // P1's first run 100.0 s with a 100-point phone penalty; the re-flight (original group, F3K.9.6: it stands) 250.0 s with 300 (F3K.4.3 person in a safety area).
    // Group: P1 250/300 = 833.3; penalties 400 → 433.3.
    const s = contestStandings({
      rounds: rounds.slice(0, 1), entries, dropRule: "f3k",
      slots: [
        run("r1", "P1", 1000, { runPenaltyPoints: 100, reflight: { placement: "original-group", entitled: true, groupNumber: 1, runResultTenths: 2500, paperFlights: null, signed: true, runPenaltyPoints: 300 } }),
        run("r1", "P2", 3000),
      ],
    });
    expect(row(s, "P1")).toMatchObject({ totalTenths: 4333, penaltyTenths: 4000 });
    expect(row(s, "P1").rounds[0]).toMatchObject({ penaltyPoints: 400, phonePenaltyPoints: 400, reflight: { stands: "reflight" } });
  });
});
