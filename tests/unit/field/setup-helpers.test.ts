import { describe, expect, it } from "vitest";
import { describeTask } from "@/lib/field/describe-task";
import { lanesFor, matchMate, planNewWindow, type NewWindowValues } from "@/lib/field/new-window";
import { prepStageAt } from "@/lib/field/prep-plan";
import { getCatalogueTask } from "@/lib/tasks";

const profile = { id: "user-1", name: "Sam Field" };
const base: NewWindowValues = {
  fieldName: "North Meadow",
  position: null,
  windMs: "3.5",
  gustMs: "",
  temperatureC: "18",
  notes: "",
  who: { mode: "me" },
  task: { source: "catalogue", letter: "H", variant: 600 },
  prepMin: "",
  noFly: false,
};

describe("describeTask", () => {
  it("says what the catalogue tasks ask (F3K.11)", () => {
    expect(describeTask(getCatalogueTask("H"))).toBe("10 min · 4 longest flights against 240, 180, 120, 60 s, any order");
    expect(describeTask(getCatalogueTask("K"))).toBe("10 min · 5 launches · flight by flight against 60, 90, 120, 150, 180 s, in order");
    expect(describeTask(getCatalogueTask("A", 420))).toBe("7 min · only the last flight counts, up to 300 s each");
    expect(describeTask(getCatalogueTask("F"))).toBe("10 min · 6 launches · the 3 longest flights count, up to 180 s each");
  });
});

describe("planNewWindow", () => {
  it("builds a solo practice run for the signed-in pilot", () => {
    const out = planNewWindow(base, profile, 1000);
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.plan.run.lanes).toEqual([{ lane: 0, pilotName: "Sam Field", pilotUserId: "user-1" }]);
    expect(out.plan.session.conditions).toEqual({ windMs: 3.5, temperatureC: 18 });
    expect(out.plan.task.letter).toBe("H");
    expect(out.plan.prep).toBeNull();
  });
  it("names each bad entry", () => {
    const out = planNewWindow({ ...base, fieldName: " ", windMs: "lots", who: { mode: "group", names: ["", " "] } }, profile, 0);
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(Object.keys(out.errors).sort()).toEqual(["fieldName", "who", "windMs"]);
  });
  it("passes a custom task's schema messages through", () => {
    const task = { source: "custom" as const, input: { name: "Ladder", workingTimeSec: 300, targetsSec: [60, 90, 400], order: "in-order" as const } };
    const out = planNewWindow({ ...base, task }, profile, 0);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors.task).toContain("A target is longer than the working time.");
  });
  it("gives guests lanes in order and plans the countdown", () => {
    const out = planNewWindow({ ...base, who: { mode: "group", names: ["Kit", "", "Rowan"] }, prepMin: "5", noFly: true }, profile, 0);
    expect(out.ok && out.plan.run.lanes).toEqual([{ lane: 0, pilotName: "Kit" }, { lane: 1, pilotName: "Rowan" }]);
    expect(out.ok && out.plan.prep).toEqual({ prepSec: 300, noFlySec: 60 });
  });
});

describe("prepStageAt", () => {
  // F3K.9: preparation, then a 60 s no-fly period just before working time.
  const plan = { beganAtWallMs: 10_000, prepSec: 300, noFlySec: 60 };
  it("counts preparation, then the no-fly minute, then is due", () => {
    expect(prepStageAt(plan, 10_000)).toEqual({ stage: "preparation", leftMs: 300_000, startsAtWallMs: 370_000 });
    expect(prepStageAt(plan, 310_000)).toEqual({ stage: "no-fly", leftMs: 60_000, startsAtWallMs: 370_000 });
    expect(prepStageAt(plan, 370_000)).toEqual({ stage: "due", startsAtWallMs: 370_000 });
  });
});

describe("lanes that name club mates", () => {
  const mates = [
    { id: "u-kit", name: "Kit Marsh" },
    { id: "u-rowan-1", name: "Rowan Vale" },
    { id: "u-rowan-2", name: "Rowan Vale" },
  ];
  it("links a name that is exactly one club mate's (ignoring case and spaces), with their own spelling", () => {
    expect(matchMate("  kit marsh ", mates)).toEqual({ id: "u-kit", name: "Kit Marsh" });
    expect(lanesFor({ mode: "partner", name: "kit MARSH" }, profile, mates)).toEqual([{ lane: 0, pilotName: "Kit Marsh", pilotUserId: "u-kit" }]);
  });
  it("times a name shared by two mates, or nobody's, as a named guest", () => {
    expect(matchMate("Rowan Vale", mates)).toBeNull();
    expect(matchMate("Kit", mates)).toBeNull();
    expect(lanesFor({ mode: "group", names: ["Rowan Vale", "", "Kit Marsh", "Pat Guest"] }, profile, mates)).toEqual([
      { lane: 0, pilotName: "Rowan Vale" },
      { lane: 1, pilotName: "Kit Marsh", pilotUserId: "u-kit" },
      { lane: 2, pilotName: "Pat Guest" },
    ]);
  });
});
