import { describe, expect, it } from "vitest";
import { roundPenalty } from "@/lib/contests/penalties";
import { contestStandings, type StandingsSlot } from "@/lib/contests/standings";
import { givePenaltySchema } from "@/lib/validations/contest-results";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

/**
 * Officers' penalties one by one (lib/contests/penalties.ts roundPenalty, the one place a round's
 * penalties are summed, and lib/contests/standings.ts). Expected numbers by hand from RULES.md
 * "Penalties" (F3K.4.3, F3K.9.5, F3K.4.1) and "Scoring across pilots" (F3K.9.1, F3K.10). Task A (last
 * flight, 300 s cap).
 */
const A = getCatalogueTask("A");
const rounds = (n: number) => Array.from({ length: n }, (_, i) => ({ id: `r${i + 1}`, number: i + 1, isFlyOff: false, task: A }));
const entry = (id: string) => ({ id, name: `Pilot ${id}`, team: null, withdrawn: false });
const run = (roundId: string, entryId: string, tenths: number, more: Partial<StandingsSlot> = {}): StandingsSlot => ({
  roundId, groupNumber: 1, entryId, runResultTenths: tenths, paperFlights: null, signed: true, penaltyPoints: 0, ...more,
});
const row = (s: ReturnType<typeof contestStandings>, id: string) => s.pilots.find((p) => p.entryId === id)!;

describe("roundPenalty", () => {
  it("sums the card's, the officers' and the phone's points", () => {
    // card 100 + officer 300 (F3K.4.3 person in a safety area) + officer 100 (F3K.9.5 outside time) + phone 100 = 600
    expect(roundPenalty({
      cardPoints: 100, phonePoints: 100,
      officer: [{ id: "a", points: 300, cause: "person-in-safety-area" }, { id: "b", points: 100, cause: "outside-time" }],
    })).toEqual({ points: 600, phonePoints: 100, zeroesRound: false });
  });

  it("counts every officer's penalty in full: not tied to an attempt, each is its own (our reading of F3K.4.3; the officer gives only the highest of one attempt)", () => {
    expect(roundPenalty({ cardPoints: 0, phonePoints: 0, officer: [
      { id: "a", points: 100, cause: "object-in-safety-area" }, { id: "b", points: 300, cause: "person-in-safety-area" },
    ] }).points).toBe(400);
  });

  it("a contact with a person at launch zeroes the round, plus its points (F3K.4.1)", () => {
    expect(roundPenalty({ cardPoints: 0, phonePoints: 0, officer: [{ id: "a", points: 100, cause: "launch-contact" }] })).toEqual({ points: 100, phonePoints: 0, zeroesRound: true });
  });

  it("nothing given, nothing taken", () => {
    expect(roundPenalty({ cardPoints: 0, phonePoints: 0, officer: [] })).toEqual({ points: 0, phonePoints: 0, zeroesRound: false });
  });
});

describe("officers' penalties in the standings", () => {
  it("are taken from the total and stay in a dropped round (F3K.10)", () => {
    // P1: 1000 in every round but r2: 150/300 → 500; drop r2 → 5000; the officer's 300 in r2 stays → 4700.0
    const slots = [1, 2, 3, 4, 5, 6].flatMap((n) => [
      run(`r${n}`, "P1", n === 2 ? 1500 : 3000, n === 2 ? { officerPenalties: [{ id: "x", points: 300, cause: "person-in-safety-area" }] } : {}),
      run(`r${n}`, "P2", n === 2 ? 3000 : 1500),
    ]);
    const s = contestStandings({ rounds: rounds(6), entries: [entry("P1"), entry("P2")], slots, dropRule: "f3k" });
    expect(row(s, "P1")).toMatchObject({ penaltyTenths: 3000, totalTenths: 47000, dropped: { index: 1 } });
    expect(row(s, "P1").rounds[1]).toMatchObject({ penaltyPoints: 300, phonePenaltyPoints: 0, zeroedByPenalty: false });
  });

  it("are added to the phone's, each counted once (the phone's 100 + the officer's 300 = 400)", () => {
    const s = contestStandings({ rounds: rounds(1), entries: [entry("P1")], dropRule: "f3k",
      slots: [run("r1", "P1", 2000, { runPenaltyPoints: 100, officerPenalties: [{ id: "x", points: 300, cause: "person-in-safety-area" }] })] });
    expect(row(s, "P1").rounds[0]).toMatchObject({ penaltyPoints: 400, phonePenaltyPoints: 100 });
    expect(row(s, "P1").totalTenths).toBe(10000 - 4000);
  });

  it("a launch contact zeroes the round and it is nobody's best: the group mate's result becomes the best (F3K.4.1, F3K.9.1)", () => {
    // P1 200.0 s would be the best; zeroed → 0 points, less 50 → −50.0. P2 150.0 s is now the best → 1000.0.
    const s = contestStandings({ rounds: rounds(1), entries: [entry("P1"), entry("P2")], dropRule: "f3k", slots: [
      run("r1", "P1", 2000, { officerPenalties: [{ id: "x", points: 50, cause: "launch-contact" }] }), run("r1", "P2", 1500),
    ] });
    expect(row(s, "P1").rounds[0]).toMatchObject({ resultTenths: 2000, pointsTenths: 0, zeroedByPenalty: true, penaltyPoints: 50 });
    expect(row(s, "P1").totalTenths).toBe(-500);
    expect(row(s, "P2").rounds[0]!.pointsTenths).toBe(10000);
  });
});

describe("givePenaltySchema", () => {
  const base = { entryId: "0190a0a0-0000-7000-8000-000000000001" };
  it("takes the rules' points for a cause that has them (F3K.4.3 300, F3K.9.5 100) and refuses others", () => {
    expect(givePenaltySchema.safeParse({ ...base, cause: "person-in-safety-area", points: 300 }).success).toBe(true);
    expect(givePenaltySchema.safeParse({ ...base, cause: "person-in-safety-area", points: 100 }).success).toBe(false);
    expect(givePenaltySchema.safeParse({ ...base, cause: "outside-time", points: 100 }).success).toBe(true);
  });
  it("the officer's points for a launch contact (0 allowed: the zero round is the penalty) and for other (not 0)", () => {
    expect(givePenaltySchema.safeParse({ ...base, cause: "launch-contact", points: 0 }).success).toBe(true);
    expect(givePenaltySchema.safeParse({ ...base, cause: "other", points: 0 }).success).toBe(false);
    expect(givePenaltySchema.safeParse({ ...base, cause: "other", points: 1001 }).success).toBe(false);
    expect(givePenaltySchema.safeParse({ ...base, cause: "other", points: 2.5 }).success).toBe(false);
  });
});
