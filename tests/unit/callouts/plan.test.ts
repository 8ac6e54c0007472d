import { describe, expect, it } from "vitest";
import { planCallouts } from "@/lib/callouts";
import { getCatalogueTask } from "@/lib/tasks";
import { due, said } from "./helpers";

describe("preparation and no-fly (F3K.9: preparation ≥ 5 min, a 60 s no-fly period, the last 5 s before test time ends and before working time starts announced)", () => {
  const plan = { startAtMs: 400_000, preparationSec: 300, noFlySec: 60 };

  it("minutes to the start, the last 5 s of test flying, no flying, the last 5 s before working time", () => {
    expect(said(planCallouts(plan))).toEqual([
      "40000 6 minutes to working time",
      "100000 5 minutes to working time",
      "160000 4 minutes to working time",
      "220000 3 minutes to working time",
      "280000 2 minutes to working time",
      "335000 5", "336000 4", "337000 3", "338000 2", "339000 1",
      "340000 No flying. 1 minute to working time",
      "395000 5", "396000 4", "397000 3", "398000 2", "399000 1",
    ]);
  });

  it("are due through calloutsDue before the working time starts, and only when the run has a plan", () => {
    const G = getCatalogueTask("G");
    expect(said(due(G, [], 339_500, 340_000, { plan }))).toEqual(["340000 No flying. 1 minute to working time"]);
    expect(due(G, [], 339_500, 340_000)).toEqual([]);
  });

  it("without a no-fly period: minutes and the last 5 s only", () => {
    const out = said(planCallouts({ startAtMs: 120_000, preparationSec: 120, noFlySec: 0 }));
    expect(out).toEqual(["0 2 minutes to working time", "60000 1 minute to working time", "115000 5", "116000 4", "117000 3", "118000 2", "119000 1"]);
  });
});
