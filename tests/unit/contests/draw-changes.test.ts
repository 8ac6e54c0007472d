import { describe, expect, it } from "vitest";
import { redrawRemaining, swapPilots, type DrawEntry } from "@/lib/contests/entries-draw";

const ids = "ABCDEFGHIJ".split("");
const entries: DrawEntry[] = ids.map((id) => ({ id, keepApart: null }));
const names = new Map(ids.map((id) => [id, `Pilot ${id}`]));

/** Pairs that flew together in both lists of groups, counted by hand-written loops (not the library's matrix). */
function repeatedPairs(first: string[][], second: string[][]): number {
  const together = (groups: string[][], x: string, y: string) => groups.some((g) => g.includes(x) && g.includes(y));
  let n = 0;
  for (let i = 0; i < ids.length; i++) for (let j = i + 1; j < ids.length; j++) if (together(first, ids[i]!, ids[j]!) && together(second, ids[i]!, ids[j]!)) n += 1;
  return n;
}

describe("re-drawing the rounds not flown yet", () => {
  const round1 = [["A", "B", "C", "D", "E"], ["F", "G", "H", "I", "J"]];

  it("counts who already met: 10 pilots in two groups of 5 after a flown round repeat the fewest pairs possible (8)", () => {
    // Hand count: a new group of 5 takes k pilots from one old group and 5 − k from the other and
    // repeats C(k,2) + C(5−k,2) pairs: 10 for k = 5, 6+0 = 6 … the least is k = 3 or 2: 3 + 1 = 4,
    // so two groups repeat at least 8 pairs. A draw that ignored round 1 could repeat up to 20.
    for (const seed of [1, 2, 3, 99, 12345]) {
      const { rounds, result } = redrawRemaining({ entries, flown: [{ roundNumber: 1, groups: round1 }], remaining: [2], maxGroupSize: 5, seed });
      expect(rounds.map((r) => r.roundNumber)).toEqual([2]);
      expect(repeatedPairs(round1, rounds[0]!.groups)).toBe(8);
      // stats over both rounds: the repeated pairs met twice, no pair more
      expect(result.stats.max).toBe(2);
    }
  });

  it("leaves a withdrawn pilot out of the new rounds and brings a late entry in", () => {
    const today = [...entries.filter((e) => e.id !== "C"), { id: "K", keepApart: null }];
    const { rounds } = redrawRemaining({ entries: today, flown: [{ roundNumber: 1, groups: round1 }], remaining: [2, 3], maxGroupSize: 5, seed: 7 });
    for (const r of rounds) {
      const flying = r.groups.flat().sort();
      expect(flying).toEqual([...ids.filter((id) => id !== "C"), "K"].sort());
      expect(r.groups.every((g) => g.length >= 5)).toBe(true); // F3K.9.1: at least 5 pilots a group
    }
  });

  it("gives the same re-draw for the same seed, whatever order the entries were read in", () => {
    const flown = [{ roundNumber: 1, groups: round1 }];
    const a = redrawRemaining({ entries, flown, remaining: [2, 3], maxGroupSize: 5, seed: 5 });
    const b = redrawRemaining({ entries: [...entries].reverse(), flown, remaining: [2, 3], maxGroupSize: 5, seed: 5 });
    expect(b.rounds).toEqual(a.rounds);
  });
});

describe("swapping two pilots of a round", () => {
  const round = ids.map((entryId, i) => ({ entryId, groupNumber: i < 5 ? 1 : 2 }));

  it("trades their groups", () => {
    expect(swapPilots({ round, a: "B", b: "H", entries, names })).toEqual({
      ok: true,
      moves: [{ entryId: "B", groupNumber: 2 }, { entryId: "H", groupNumber: 1 }],
    });
  });

  it("refuses pilots of one group, one pilot twice and a pilot not in the round, saying why", () => {
    expect(swapPilots({ round, a: "A", b: "B", entries, names })).toEqual({ ok: false, reason: "Pilot A and Pilot B already fly in group 1." });
    expect(swapPilots({ round, a: "A", b: "A", entries, names })).toEqual({ ok: false, reason: "Choose two different pilots." });
    expect(swapPilots({ round, a: "A", b: "Z", entries, names })).toEqual({ ok: false, reason: "that pilot does not fly in this round." });
  });

  it("refuses a swap that puts a pilot with one they are kept apart from (any case), and allows the two who share the word to trade", () => {
    const apart = entries.map((e) => (e.id === "B" || e.id === "G" ? { ...e, keepApart: e.id === "B" ? "Sam's helper" : "sam's HELPER" } : e));
    expect(swapPilots({ round, a: "B", b: "H", entries: apart, names })).toEqual({ ok: false, reason: "Pilot B is to be kept apart from Pilot G, who flies in group 2." });
    expect(swapPilots({ round, a: "F", b: "G", entries: apart, names }).ok).toBe(false); // both fly in group 2 already
    expect(swapPilots({ round, a: "A", b: "G", entries: apart, names })).toEqual({ ok: false, reason: "Pilot G is to be kept apart from Pilot B, who flies in group 1." });
    expect(swapPilots({ round, a: "B", b: "G", entries: apart, names }).ok).toBe(true); // they only trade places: still apart
  });
});
