import { describe, expect, it } from "vitest";
import { normaliseUnits } from "@/lib/scoring";
import { DEFAULT_RULE_SETTINGS, foldRun, getCatalogueTask, ruleSettingsOf, taskDefinitionSchema, withRuleSettings } from "@/lib/tasks";
import { eventLog } from "./helpers";

describe("scoring choices stored with the run's task (README choices; AMBIGUOUS in RULES.md)", () => {
  it("ours: the defaults are halves up and the end call credits the time flown", () => {
    expect(DEFAULT_RULE_SETTINGS).toEqual({ halves: "half-up", endCall: "flown" });
    expect(ruleSettingsOf(getCatalogueTask("H"))).toEqual(DEFAULT_RULE_SETTINGS);
  });
  it("the rounding choice survives the schema the server stores a run's task with", () => {
    const def = withRuleSettings(getCatalogueTask("H"), { halves: "half-even", endCall: "flown" });
    const stored = taskDefinitionSchema.parse(JSON.parse(JSON.stringify(def)));
    expect(ruleSettingsOf(stored).halves).toBe("half-even");
  });
  it("an unknown rounding is refused", () => {
    expect(taskDefinitionSchema.safeParse({ ...getCatalogueTask("H"), halves: "banker" }).success).toBe(false);
  });
  it("F3K.9.1: the stored choice decides an exact half of 0.1 point", () => {
    // 0.5 s against a best of 2000.0 s: 5 / 20000 × 10000 = 2.5 tenths of a point, an exact half.
    const score = (halves: "half-up" | "half-even" | "down") => {
      const def = taskDefinitionSchema.parse(withRuleSettings(getCatalogueTask("H"), { halves, endCall: "flown" }));
      return normaliseUnits([20_000, 5], ruleSettingsOf(def).halves)[1];
    };
    expect([score("half-up"), score("half-even"), score("down")]).toEqual([3, 2, 2]);
  });
  it("F3K.11.5: the stored end-call choice decides what the one attempt after the call credits", () => {
    const log = eventLog();
    log.start(0);
    log.add(400_000, { kind: "end-call", lane: 0 });
    log.flight(400_000, 590_000); // lands 10 s before the end of working time
    const result = (endCall: "flown" | "airborne-at-end") =>
      foldRun(taskDefinitionSchema.parse(withRuleSettings(getCatalogueTask("E"), { halves: "half-up", endCall })), log.events).lanes[0]!.resultTenths;
    expect([result("flown"), result("airborne-at-end")]).toEqual([1900, 0]);
  });
  it("the end-call choice is not added to tasks other than E", () => {
    expect("endCall" in withRuleSettings(getCatalogueTask("H"), { halves: "down", endCall: "not-allowed" })).toBe(false);
  });
});
