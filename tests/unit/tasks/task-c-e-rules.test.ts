import { describe, expect, it } from "vitest";
import { foldRun, getCatalogueTask, parseTaskDefinition, scoreTask, taskDefinitionSchema, type AllUpTask } from "@/lib/tasks";
import { eventLog } from "./helpers";

const attempt = (secs: number) => ({ launchMs: 500, landMs: 500 + secs * 1000 });

describe("task C: 3 to 5 attempts exactly (F3K.11.3)", () => {
  it("a definition with 2 or 6 attempts is refused; 3, 4 and 5 are accepted", () => {
    const C = getCatalogueTask("C");
    expect(taskDefinitionSchema.safeParse({ ...C, attempts: 2 }).success).toBe(false);
    expect(taskDefinitionSchema.safeParse({ ...C, attempts: 6 }).success).toBe(false);
    for (const n of [3, 4, 5]) expect(taskDefinitionSchema.safeParse({ ...C, attempts: n }).success).toBe(true);
  });
  it("the refusal says it in words", () => {
    expect(() => parseTaskDefinition({ ...getCatalogueTask("C"), attempts: 10 })).toThrow("Task C has at most 5 attempts.");
  });
  it("scoring refuses 1 or 10 attempts", () => {
    expect(() => scoreTask({ task: "C", attempts: 1, flights: [attempt(100)] })).toThrow(/at least 3 attempts/);
    expect(() => scoreTask({ task: "C", attempts: 10, flights: [attempt(100)] })).toThrow(/at most 5 attempts/);
    expect(() => scoreTask({ task: { ...(getCatalogueTask("C") as AllUpTask), attempts: 7 }, flights: [] })).toThrow(/at most 5 attempts/);
  });
  it("ours: with no attempt count, two flights are scored as the shortest task C, 3 attempts (the third not flown)", () => {
    // 100 + 120 + 0 (not flown) = 220 s, out of 3 × 180 = 540 s.
    const r = scoreTask({ task: "C", flights: [attempt(100), attempt(120)] });
    expect([r.seconds, r.maxSeconds]).toEqual([220, 540]);
  });
  it("six flights cannot be a task C", () => {
    expect(() => scoreTask({ task: "C", flights: Array.from({ length: 6 }, () => attempt(60)) })).toThrow(/at most 5 attempts/);
  });
});

describe("task E: a target is announced before the launch that attempts it (F3K.11.5)", () => {
  const E = getCatalogueTask("E");
  it("a target entered at the landing does not count for that flight", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000);
    log.land(61_000);
    log.add(61_000, { kind: "target", lane: 0, targetSec: 60 });
    const lane = foldRun(E, log.events).lanes[0]!;
    expect(lane.resultTenths).toBe(0);
    expect(lane.flights[0]).toMatchObject({ status: "not-counted", reason: "no-target" });
  });
  it("a target entered while the model is in the air, later than right after release, is refused", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000);
    const late = log.add(30_000, { kind: "target", lane: 0, targetSec: 45 });
    log.land(61_000);
    // The late call is not carried over to the next flight either: announce it again before that launch.
    log.flight(62_000, 120_000);
    const lane = foldRun(E, log.events).lanes[0]!;
    expect(lane.resultTenths).toBe(0);
    expect(lane.poker?.refusedCallIds).toEqual([late]);
  });
  it("ours: a target shown within 5 s of release applies to the flight in the air", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000);
    log.add(6000, { kind: "target", lane: 0, targetSec: 30 });
    log.land(40_000);
    expect(foldRun(E, log.events).lanes[0]!.resultTenths).toBe(300);
  });
  it("a target announced before the launch counts (the published example of F3K.11.5 still scores 142 s)", () => {
    const r = scoreTask({
      task: "E",
      flights: [
        { launchMs: 0, landMs: 46_000, targetSec: 45 },
        { launchMs: 47_000, landMs: 95_000, targetSec: 50 },
        { launchMs: 96_000, landMs: 148_000 },
        { launchMs: 149_000, landMs: 198_000, targetSec: 47 },
      ],
    });
    expect(r.seconds).toBe(142);
  });
});
