import { describe, expect, it } from "vitest";
import { drawEntries } from "@/lib/contests/entries-draw";

const entries = Array.from({ length: 20 }, (_, i) => ({ id: `e${String(i).padStart(2, "0")}`, keepApart: i < 3 ? "Shared timekeeper" : i === 5 ? "shared TIMEKEEPER" : null }));

describe("a contest's draw from its entries (F3K.9.1)", () => {
  it("keeps entries sharing a keep-apart word (any case) out of one group in every round", () => {
    const { rounds, result } = drawEntries({ entries, rounds: [1, 2, 3, 4, 5], maxGroupSize: 5, seed: 11 });
    expect(result.apartBroken).toBe(0);
    for (const r of rounds) for (const g of r.groups) expect(g.filter((id) => ["e00", "e01", "e02", "e05"].includes(id)).length).toBeLessThanOrEqual(1);
  });
  it("gives the same draw whatever order the entries were read in", () => {
    const a = drawEntries({ entries, rounds: [1, 2, 3], maxGroupSize: 6, seed: 4 });
    const b = drawEntries({ entries: [...entries].reverse(), rounds: [1, 2, 3], maxGroupSize: 6, seed: 4 });
    expect(b.rounds).toEqual(a.rounds);
    expect(a.rounds.map((r) => r.roundNumber)).toEqual([1, 2, 3]);
  });
});
