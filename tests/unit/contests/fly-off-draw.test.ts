import { describe, expect, it } from "vitest";
import { drawFlyOff } from "@/lib/contests/fly-off-draw";
import { parseRoundKey, roundKey, roundName } from "@/lib/contests/round-key";
import { contestStandings, type StandingsInput, type StandingsSlot } from "@/lib/contests/standings";
import { getCatalogueTask } from "@/lib/tasks/catalogue";

/**
 * The fly-off from draw to final order, every number computed by hand from RULES.md "Scoring across
 * pilots": round points normalised on the group's best = 1000 (F3K.9.1), no drop under 6 rounds and
 * ties share a place when the dropped score cannot break them (F3K.10, F3K.10.2), and the fly-off:
 * 3–6 rounds, preliminary points and penalties do not carry over (F3K.10). Who qualifies and what
 * happens at a tie on the cut-off are not in RULES.md: all pilots sharing the cut-off place fly
 * (common practice). Task A (last flight, 300 s cap) throughout, one group per round.
 */
const A = getCatalogueTask("A");
const prelim = (n: number) => Array.from({ length: n }, (_, i) => ({ id: `r${i + 1}`, number: i + 1, isFlyOff: false, task: A }));
const flyOffRounds = (n: number) => Array.from({ length: n }, (_, i) => ({ id: `f${i + 1}`, number: i + 1, isFlyOff: true, task: A }));
const entry = (id: string, withdrawn = false) => ({ id, name: `Pilot ${id}`, team: null, withdrawn });
const slot = (roundId: string, entryId: string, tenths: number | null, penaltyPoints = 0): StandingsSlot => ({
  roundId, groupNumber: 1, entryId, runResultTenths: tenths, paperFlights: null, signed: true, penaltyPoints,
});
/** Five preliminary rounds, each pilot the same result every round (tenths). */
const fiveRounds = (byPilot: Record<string, number>) => Object.entries(byPilot).flatMap(([id, t]) => prelim(5).map((r) => slot(r.id, id, t)));

// P1 300.0 s → 1000 a round, 5000; P2 270.0 s → 900, 4500; P3 and P4 240.0 s → 800, 4000 each
// (5 rounds: nothing dropped, so the tie cannot be broken: both 3rd); P5 150.0 s → 500, 2500.
const times = { P1: 3000, P2: 2700, P3: 2400, P4: 2400, P5: 1500 };
const base: StandingsInput = { rounds: [...prelim(5), ...flyOffRounds(3)], entries: Object.keys(times).map((id) => entry(id)), slots: fiveRounds(times), dropRule: "f3k" };
const draw = (input: StandingsInput, n: number) => drawFlyOff(input, contestStandings(input), n);

describe("drawing the fly-off from the preliminary order", () => {
  it("a fly-off planned but not drawn has no table yet: the preliminary order stands", () => {
    const s = contestStandings(base);
    expect(s.flyOff).toBeNull();
    expect(s.final.map((f) => f.stage)).toEqual(Array(5).fill("preliminary"));
  });
  it("takes the top N of the one standings value", () => {
    expect(contestStandings(base).pilots.map((p) => [p.entryId, p.totalTenths, p.rank])).toEqual([["P1", 50000, 1], ["P2", 45000, 2], ["P3", 40000, 3], ["P4", 40000, 3], ["P5", 25000, 5]]);
    expect(draw(base, 2)).toEqual({ ok: true, entryIds: ["P1", "P2"], names: ["Pilot P1", "Pilot P2"], tiedAtCutOff: [], cutOffRank: 2 });
  });
  it("a tie at the cut-off: every pilot sharing the last place flies (common practice; RULES.md is silent)", () => {
    expect(draw(base, 3)).toMatchObject({ ok: true, entryIds: ["P1", "P2", "P3", "P4"], tiedAtCutOff: ["Pilot P3", "Pilot P4"], cutOffRank: 3 });
    // the tied pair fits inside the number: no one came in on the tie
    expect(draw(base, 4)).toMatchObject({ ok: true, entryIds: ["P1", "P2", "P3", "P4"], tiedAtCutOff: [] });
    // more asked than can fly: everyone
    expect(draw(base, 30)).toMatchObject({ ok: true, entryIds: ["P1", "P2", "P3", "P4", "P5"] });
  });
  it("a withdrawn pilot does not fly; their missing results do not hold the fly-off back", () => {
    const input = { ...base, entries: base.entries.map((e) => (e.id === "P1" ? entry("P1", true) : e)) };
    expect(draw(input, 3)).toMatchObject({ ok: true, entryIds: ["P2", "P3", "P4"], tiedAtCutOff: [] });
    const late = { ...base, entries: base.entries.map((e) => (e.id === "P5" ? entry("P5", true) : e)), slots: base.slots.filter((s) => !(s.entryId === "P5" && s.roundId === "r5")) };
    expect(draw(late, 2)).toMatchObject({ ok: true, entryIds: ["P1", "P2"] });
  });
  it("refuses while a preliminary round has a pilot without a result or no draw", () => {
    const open = { ...base, slots: base.slots.map((s) => (s.entryId === "P5" && s.roundId === "r5" ? slot("r5", "P5", null) : s)) };
    expect(draw(open, 3)).toEqual({ ok: false, problem: "Score every preliminary round before the fly-off is drawn: round 5 has 1 pilot without a result." });
    const sixth = { ...base, rounds: [...prelim(6), ...flyOffRounds(3)] };
    expect(draw(sixth, 3)).toEqual({ ok: false, problem: "Score every preliminary round before the fly-off is drawn: round 6 has no draw." });
  });
  it("needs two pilots who can fly", () => {
    const one = { ...base, entries: base.entries.map((e) => entry(e.id, e.id !== "P1")) };
    expect(draw(one, 3)).toEqual({ ok: false, problem: "A fly-off needs at least 2 pilots; 1 can fly." });
  });
});

describe("the fly-off decides the top places once 3 rounds are complete (F3K.10)", () => {
  it("normalises each fly-off round on its own, counts fly-off penalties only, ignores a round not yet complete", () => {
    const drawn = draw(base, 3);
    if (!drawn.ok) throw new Error(drawn.problem);
    // P1, P2, P3, P4 fly. Fly-off results (tenths) → points on the round's best = 1000:
    //   f1: P1 300.0 → 1000, P2 240.0 → 800,  P3 150.0 → 500, P4 120.0 → 400
    //   f2: P1 200.0 → 800,  P2 250.0 → 1000, P3 225.0 → 900, P4 250.0 → 1000
    //   f3: P1 270.0 → 900,  P2 150.0 → 500,  P3 300.0 → 1000, P4 0.0 → 0
    //   f4 (planned 4, only P1 flown so far): not complete, does not count.
    // P3 has 100 penalty points in f2. Totals: P1 2700; P2 2300; P3 2400 − 100 = 2300; P4 1400.
    // P2 and P3 tie (no round dropped in a fly-off: nothing breaks it) and share 2nd; P4 4th; P5,
    // 5th in the preliminary order, comes after the fly-off pilots: 5th.
    const fly: Record<string, [number, number, number]> = { P1: [3000, 2000, 2700], P2: [2400, 2500, 1500], P3: [1500, 2250, 3000], P4: [1200, 2500, 0] };
    const flown = Object.entries(fly).flatMap(([id, t]) => t.map((x, i) => slot(`f${i + 1}`, id, x, id === "P3" && i === 1 ? 100 : 0)));
    const input: StandingsInput = { ...base, rounds: [...prelim(5), ...flyOffRounds(4)], slots: [...base.slots, ...flown, slot("f4", "P1", 3000)] };
    expect(drawn.entryIds).toEqual(Object.keys(fly));
    const s = contestStandings(input);
    expect(s.flyOff!.counted).toBe(true);
    expect(s.flyOff!.rounds.map((r) => r.number)).toEqual([1, 2, 3]);
    expect(s.flyOff!.pilots.map((p) => [p.entryId, p.totalTenths, p.rank])).toEqual([["P1", 27000, 1], ["P2", 23000, 2], ["P3", 23000, 2], ["P4", 14000, 4]]);
    expect(s.final.map((f) => [f.pilotId, f.rank, f.stage])).toEqual([["P1", 1, "fly-off"], ["P2", 2, "fly-off"], ["P3", 2, "fly-off"], ["P4", 4, "fly-off"], ["P5", 5, "preliminary"]]);
    // the preliminary order is unchanged by the fly-off (its points do not flow back)
    expect(s.pilots.map((p) => p.totalTenths)).toEqual([50000, 45000, 40000, 40000, 25000]);
  });
});

describe("a round's URL segment", () => {
  it("names preliminary rounds by number and fly-off rounds apart", () => {
    expect([roundKey({ number: 3, flyOff: false }), roundKey({ number: 2, flyOff: true })]).toEqual(["3", "fly-off-2"]);
    expect(roundName({ number: 2, flyOff: true })).toBe("Fly-off round 2");
    expect(parseRoundKey("fly-off-2")).toEqual({ number: 2, flyOff: true });
    expect(parseRoundKey("12")).toEqual({ number: 12, flyOff: false });
    for (const bad of ["0", "fly-off-0", "fly-off-", "100", "F1", "1a", ""]) expect(parseRoundKey(bad), bad).toBeNull();
  });
});
