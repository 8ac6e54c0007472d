import { describe, expect, it } from "vitest";
import { buildCustomTask, foldRun, maxResultTenths, scoreTask } from "@/lib/tasks";
import { backToBack } from "./helpers";

describe("custom practice tasks", () => {
  it("a 5-minute window, cap 45 s, best 4", () => {
    const def = buildCustomTask({ name: "Short ones", workingTimeSec: 300, capSec: 45, counting: "best", count: 4 });
    expect(def).toMatchObject({ edition: "custom", letter: null, kind: "window" });
    // 50→45, 40, 30, 46→45, 20: best four 45 + 45 + 40 + 30 = 160.
    expect(scoreTask({ task: def, flights: backToBack([50, 40, 30, 46, 20]) }).seconds).toBe(160);
    expect(maxResultTenths(def)).toBe(1800);
  });
  it("an in-order ladder of 30, 45, 60 gets a launch limit of 3", () => {
    const def = buildCustomTask({ name: "Small ladder", workingTimeSec: 300, targetsSec: [30, 45, 60] });
    expect(def.kind === "window" && def.launchLimit).toBe(3);
    // 35→30, 40 (short), 70→60, 4th launch ignored: 130.
    expect(scoreTask({ task: def, flights: backToBack([35, 40, 70, 50]) }).seconds).toBe(130);
  });
  it("an any-order ladder, last 3 flights", () => {
    const def = buildCustomTask({ name: "Last three any order", workingTimeSec: 600, targetsSec: [60, 90, 120], order: "any-order", counting: "last" });
    // last three of 200, 95, 58, 130: 95, 58, 130 → 130→120, 95→90, 58→60 slot: 58 → 268.
    expect(scoreTask({ task: def, flights: backToBack([200, 95, 58, 130]) }).seconds).toBe(268);
  });
  it("all flights, no cap: the sum cap bounds it", () => {
    const def = buildCustomTask({ name: "Airtime", workingTimeSec: 120, counting: "all" });
    expect(maxResultTenths(def)).toBe(1190);
    expect(foldRun(def, []).lanes[0]!.resultTenths).toBe(0);
  });
  it("rejects contradictions with readable messages", () => {
    expect(() => buildCustomTask({ name: "x", workingTimeSec: 10 })).toThrow(/at least 30 s/);
    expect(() => buildCustomTask({ name: "x", workingTimeSec: 300, targetsSec: [30, 60], launchLimit: 3 })).toThrow(/launch limit of 2/);
    expect(() => buildCustomTask({ name: "x", workingTimeSec: 300, targetsSec: [30, 60], order: "any-order" })).toThrow(/best or the last/);
    expect(() => buildCustomTask({ name: "x", workingTimeSec: 300, targetsSec: [400] })).toThrow(/longer than the working time/);
    expect(() => buildCustomTask({ name: " ", workingTimeSec: 300 })).toThrow(/name/);
  });
});
