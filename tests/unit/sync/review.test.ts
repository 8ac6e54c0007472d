import { describe, expect, it } from "vitest";
import { deriveRun } from "@/lib/sync/derive";
import { getCatalogueTask } from "@/lib/tasks";
import { device, estimatesOf } from "./helpers";

const H = getCatalogueTask("H");
const C = { ...getCatalogueTask("C"), attempts: 1 } as ReturnType<typeof getCatalogueTask>;
const lanes = [{ lane: 0, pilotUserId: "pilot" }];

/** Signal on the keeper's phone at 0; the pilot's phone times a launch at `launchMs`. */
function signalElsewhere(launchMs: number, boundMs: { keeper: number; pilot: number }, task = H, pilotMeasured = true) {
  const keeper = device("keeper", "keeper-user", { thetaMs: 1234, boundMs: boundMs.keeper });
  const pilot = device("pilot", "pilot", { thetaMs: -90_000, boundMs: boundMs.pilot, measured: pilotMeasured });
  keeper.at(0, { kind: "window-start" });
  pilot.at(launchMs, { kind: "launch", lane: 0 });
  pilot.at(launchMs + 60_000, { kind: "landing", lane: 0 });
  return deriveRun({ createdBy: "keeper-user", officials: new Set(), task, lanes, events: [...keeper.events, ...pilot.events], estimatesByDevice: estimatesOf(keeper, pilot) })[0]!;
}

describe("launches judged against a signal given on another device (SYNC.md §4)", () => {
  it("a launch clearly after the signal is scored without review", () => {
    const lane = signalElsewhere(2000, { keeper: 30, pilot: 40 });
    expect(lane.needsReview).toBe(false);
    expect(lane.resultTenths).toBe(600);
  });

  it("a launch 50 ms after the signal with clocks good to ±30 and ±40 ms is uncertain → review", () => {
    const lane = signalElsewhere(50, { keeper: 30, pilot: 40 });
    expect(lane.needsReview).toBe(true);
    expect(lane.reviewReason).toBe("Flight 1: 0.05 s from the working-time signal timed on another device (clocks ±0.07 s)");
    expect(lane.derived.review[0]?.boundary).toBe("working-time signal");
    // δ/2 of both phones plus 15 ppm drift for the few ms since each was measured
    expect(lane.derived.review[0]?.marginMs).toBeCloseTo(70, 2);
    expect(lane.resultTenths).toBe(600); // the best estimate stays visible beside the flag
  });

  it("the same 50 ms with clocks good to ±10 ms each is decided: after the signal", () => {
    expect(signalElsewhere(50, { keeper: 10, pilot: 10 }).needsReview).toBe(false);
  });

  it("a phone that never measured its clock cannot be judged against another's signal", () => {
    const lane = signalElsewhere(30_000, { keeper: 10, pilot: 10 }, H, false);
    expect(lane.needsReview).toBe(true);
    expect(lane.reviewReason).toMatch(/a clock never measured/);
  });

  it("signal and launch on the same phone are never sent to review, however close", () => {
    const phone = device("phone", "pilot", { boundMs: 500 });
    phone.at(0, { kind: "window-start" });
    phone.at(10, { kind: "launch", lane: 0 });
    phone.at(60_010, { kind: "landing", lane: 0 });
    const [lane] = deriveRun({ createdBy: "keeper-user", officials: new Set(), task: H, lanes, events: phone.events, estimatesByDevice: estimatesOf(phone) });
    expect(lane!.needsReview).toBe(false);
  });

  it("task C: a launch near the end of the 3 s launch window is uncertain → review", () => {
    const lane = signalElsewhere(3020, { keeper: 20, pilot: 20 }, C);
    expect(lane.needsReview).toBe(true);
    expect(lane.derived.review[0]?.boundary).toBe("end of the launch window");
  });

  it("a landing near the end of the landing window is uncertain → review", () => {
    const keeper = device("keeper", "keeper-user", { boundMs: 25 });
    const pilot = device("pilot", "pilot", { thetaMs: 4000, boundMs: 25 });
    keeper.at(0, { kind: "window-start" });
    pilot.at(500_000, { kind: "launch", lane: 0 });
    pilot.at(630_010, { kind: "landing", lane: 0 }); // 10 min working time + 30 s landing window, 10 ms late
    const [lane] = deriveRun({ createdBy: "keeper-user", officials: new Set(), task: H, lanes, events: [...keeper.events, ...pilot.events], estimatesByDevice: estimatesOf(keeper, pilot) });
    expect(lane!.derived.review.map((r) => r.boundary)).toEqual(["end of the landing window"]);
  });
});
