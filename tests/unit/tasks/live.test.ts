import { describe, expect, it } from "vitest";
import { getCatalogueTask, liveState } from "@/lib/tasks";
import { eventLog } from "./helpers";

const codes = (s: ReturnType<typeof liveState>, lane = 0) => s.lanes[lane]!.warnings.map((w) => w.code);

describe("liveState: clock and flights", () => {
  it("before the start: not started, and a launch now scores zero", () => {
    const s = liveState(getCatalogueTask("G"), [], 5000);
    expect(s.phase).toBe("not-started");
    expect(s.workingTimeLeftMs).toBeNull();
    expect(codes(s)).toContain("launch-scores-zero");
  });
  it("during working time: time left, current flight, result landed and if landed now", () => {
    const log = eventLog();
    log.start(10_000);
    log.flight(10_000, 70_000); // 60 s
    log.launch(70_300);
    const s = liveState(getCatalogueTask("G"), log.events, 100_300); // 30 s into flight 2
    expect(s.phase).toBe("working");
    expect(s.workingTimeLeftMs).toBe(509_700); // 600 − 90.3 s
    const lane = s.lanes[0]!;
    expect(lane.currentFlightMs).toBe(30_000);
    expect(lane.resultTenths).toBe(600);
    expect(lane.ifLandedNowTenths).toBe(900);
    expect(lane.flights.map((f) => f.status)).toEqual(["counted", "open"]);
  });
  it("after working time: the landing window counts down, then a landing scores zero", () => {
    const log = eventLog();
    log.start(0);
    log.launch(500_000);
    const during = liveState(getCatalogueTask("N"), log.events, 610_000);
    expect(during.phase).toBe("landing-window");
    expect(during.landingWindowLeftMs).toBe(20_000);
    expect(during.lanes[0]!.warnings.find((w) => w.code === "land-within-window")?.message).toMatch(/20 s/);
    const late = liveState(getCatalogueTask("N"), log.events, 631_000);
    expect(late.phase).toBe("ended");
    expect(codes(late)).toContain("landing-scores-zero");
    expect(late.lanes[0]!.ifLandedNowTenths).toBe(0);
  });
  it("warns when the launch limit is used up (task D)", () => {
    const log = eventLog();
    log.start(0);
    log.flight(0, 100_000);
    log.flight(101_000, 200_000);
    const s = liveState(getCatalogueTask("D"), log.events, 201_000);
    expect(s.lanes[0]!.launchesLeft).toBe(0);
    expect(codes(s)).toContain("launch-will-not-count");
  });
  it("warns that a new launch cancels task A's result", () => {
    const log = eventLog();
    log.start(0);
    log.flight(0, 100_000);
    const s = liveState(getCatalogueTask("A"), log.events, 101_000);
    expect(s.lanes[0]!.warnings[0]).toEqual({ code: "next-launch-replaces", message: "A new launch cancels the current result (1:40.0)." });
  });
  it("warns when the flight in the air has reached its cap", () => {
    const log = eventLog();
    log.start(0);
    log.launch(0);
    expect(codes(liveState(getCatalogueTask("G"), log.events, 125_000))).toContain("flight-at-maximum");
  });
});

describe("liveState: best still possible", () => {
  it("is the maximum at the start", () => {
    const log = eventLog();
    log.start(0);
    const s = liveState(getCatalogueTask("H"), log.events, 0);
    expect(s.lanes[0]!.bestPossibleTenths).toBe(5960);
  });
  it("task H after a 63 s flight: every way of placing it is tried", () => {
    // 536 s left; 63 → 60 slot (60), new flights 240+180+120 = 540 ≥ 536 → 60 + 536 = 596 (= sum cap).
    const log = eventLog();
    log.start(0);
    log.flight(0, 63_000);
    const s = liveState(getCatalogueTask("H"), log.events, 64_000);
    expect(s.lanes[0]!.bestPossibleTenths).toBe(5960);
    // 100 s later on the ground: 436 s left. 63 → 60 slot: 60 + 436 = 496; better, 63 → 120
    // slot kept whole: 63 + min(436, 240 + 180 + 60 = 480) = 499.
    expect(liveState(getCatalogueTask("H"), log.events, 164_000).lanes[0]!.bestPossibleTenths).toBe(4990);
  });
  it("task K: steps already flown are fixed", () => {
    // Flight 1 = 30 s (short of 60). Left: 90+120+150+180 = 540 needed, 569 s left → 30 + 540 = 570.
    const log = eventLog();
    log.start(0);
    log.flight(0, 30_000);
    const s = liveState(getCatalogueTask("K"), log.events, 31_000);
    expect(s.lanes[0]!.bestPossibleTenths).toBe(5700);
    expect(s.lanes[0]!.nextTargetSec).toBe(90);
    expect(s.lanes[0]!.remainingTargetsSec).toEqual([90, 120, 150, 180]);
  });
  it("task A: the best is the cap while a full flight still fits, then the time left", () => {
    const log = eventLog();
    log.start(0);
    log.flight(0, 100_000);
    expect(liveState(getCatalogueTask("A"), log.events, 200_000).lanes[0]!.bestPossibleTenths).toBe(3000);
    // 480 s in: 120 s left → a new flight could make 120; keeping the 100 s flight is less.
    expect(liveState(getCatalogueTask("A"), log.events, 480_000).lanes[0]!.bestPossibleTenths).toBe(1200);
  });
  it("task E: an unreachable pending target freezes the result", () => {
    const log = eventLog();
    log.start(0);
    log.add(500_000, { kind: "target", lane: 0, targetSec: 200 });
    const s = liveState(getCatalogueTask("E"), log.events, 500_000);
    expect(s.lanes[0]!.bestPossibleTenths).toBe(0);
    expect(codes(s)).toContain("target-unreachable");
    expect(s.lanes[0]!.nextTargetSec).toBe(200);
  });
  it("task C: attempts to come may still reach 180 s", () => {
    const log = eventLog();
    log.start(0);
    log.flight(1000, 121_000);
    const s = liveState(getCatalogueTask("C", 3), log.events, 200_000);
    expect(s.attempt).toEqual({ index: 0, of: 3 });
    expect(s.lanes[0]!.bestPossibleTenths).toBe(1200 + 1800 + 1800);
    expect(s.lanes[0]!.launchesLeft).toBe(2);
  });
});

describe("liveState: next target", () => {
  it("task H: the longest unmet target that fits in the time left", () => {
    const log = eventLog();
    log.start(0);
    log.flight(0, 241_000); // 240 met
    const s = liveState(getCatalogueTask("H"), log.events, 242_000);
    expect(s.lanes[0]!.remainingTargetsSec).toEqual([180, 120, 60]);
    expect(s.lanes[0]!.nextTargetSec).toBe(180);
    // With 150 s left, 180 no longer fits: suggest 120.
    expect(liveState(getCatalogueTask("H"), log.events, 450_000).lanes[0]!.nextTargetSec).toBe(120);
  });
  it("task M: the step of the flight in the air", () => {
    const log = eventLog();
    log.start(0);
    log.flight(0, 181_000);
    log.launch(182_000);
    expect(liveState(getCatalogueTask("M"), log.events, 190_000).lanes[0]!.nextTargetSec).toBe(300);
  });
});
