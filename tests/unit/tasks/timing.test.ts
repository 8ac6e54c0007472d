import { describe, expect, it } from "vitest";
import { foldRun, getCatalogueTask, msToTenths, scoreTask } from "@/lib/tasks";
import { eventLog } from "./helpers";

describe("msToTenths (F3K.7: to 0.1 s, never rounded up)", () => {
  it("truncates", () => {
    expect(msToTenths(183_960)).toBe(1839); // F3K.7 example: 183.96 → 183.9
    expect(msToTenths(183_999.9999)).toBe(1839);
    expect(msToTenths(99)).toBe(0);
    expect(msToTenths(100)).toBe(1);
  });
  it("gives 0 for negative or non-finite durations", () => {
    expect(msToTenths(-5)).toBe(0);
    expect(msToTenths(Number.NaN)).toBe(0);
  });
});

describe("flight timing in working time (F3K.7)", () => {
  it("a flight launched before working time scores zero", () => {
    const r = scoreTask({ task: "N", flights: [{ launchMs: -1, landMs: 200_000 }] });
    expect(r.seconds).toBe(0);
    expect(r.flights[0]?.reason).toBe("launched-before-working-time");
  });
  it("a launch at the start signal exactly is in time", () => {
    expect(scoreTask({ task: "N", flights: [{ launchMs: 0, landMs: 200_000 }] }).seconds).toBe(200);
  });
  it("time counts up to the end of working time only", () => {
    // launched at 500 s, lands at 620 s: 100 s counted.
    expect(scoreTask({ task: "N", flights: [{ launchMs: 500_000, landMs: 620_000 }] }).seconds).toBe(100);
  });
  it("a landing after the 30 s landing window scores zero; at 30.000 s exactly it counts", () => {
    expect(scoreTask({ task: "N", flights: [{ launchMs: 500_000, landMs: 630_000 }] }).seconds).toBe(100);
    const late = scoreTask({ task: "N", flights: [{ launchMs: 500_000, landMs: 630_001 }] });
    expect(late.seconds).toBe(0);
    expect(late.flights[0]?.reason).toBe("landed-after-landing-window");
  });
  it("a model that never landed scores zero", () => {
    expect(scoreTask({ task: "N", flights: [{ launchMs: 0, landMs: null }] }).flights[0]?.reason).toBe("never-landed");
  });
  it("a launch at or after the end of working time is outside the task and does not cancel task A's result", () => {
    // 200 s flight, then a launch at 600 s: A keeps 200.
    const r = scoreTask({ task: "A", flights: [{ launchMs: 0, landMs: 200_000 }, { launchMs: 600_000, landMs: 610_000 }] });
    expect(r.seconds).toBe(200);
    expect(r.flights[1]?.reason).toBe("launched-after-working-time");
  });
  it("an early launch still uses one of a limited task's launches (our reading)", () => {
    // D: early launch (zero) + one valid 250 s flight; a third launch does not count.
    const r = scoreTask({ task: "D", flights: [{ launchMs: -2000, landMs: 10_000 }, { launchMs: 11_000, landMs: 261_000 }, { launchMs: 262_000, landMs: 400_000 }] });
    expect(r.seconds).toBe(250);
    expect(r.flights.map((f) => f.reason)).toEqual(["launched-before-working-time", null, "beyond-launch-limit"]);
  });
  it("an invalid flight (landing outside the field, part lost) scores zero — F3K.6.2, F3K.2.2", () => {
    const log = eventLog();
    log.start(0);
    log.flight(1000, 101_000);
    log.flight(102_000, 152_000);
    log.add(160_000, { kind: "invalid", lane: 0, flightIndex: 0, reason: "landing-outside-field" });
    const lane = foldRun(getCatalogueTask("G"), log.events).lanes[0]!;
    expect(lane.flights.map((f) => f.status)).toEqual(["invalid", "counted"]);
    expect(lane.resultTenths).toBe(500);
  });
  it("without a window-start every launch is before working time", () => {
    const log = eventLog();
    log.flight(1000, 101_000);
    const lane = foldRun(getCatalogueTask("N"), log.events).lanes[0]!;
    expect(lane.resultTenths).toBe(0);
    expect(lane.flights[0]?.reason).toBe("launched-before-working-time");
  });
});
