import { describe, expect, it } from "vitest";
import type { EventBody } from "@/lib/events/schema";
import { runResult, type RecordedEvent } from "@/lib/results";
import type { TaskDefinition } from "@/lib/tasks";

/**
 * A record chosen by hand (DerivationInput.standing: an officer's decision on a club day) stands in
 * place of the conflict rules' pick (SYNC.md §3: the pilot's own record first). Hand-made run of a
 * custom task (best three flights, each capped at 60 s): the pilot's phone "own" timed 2→22 and 25→90
 * (20.0 + 60.0, capped from 65.0 = 80.0 s); a club mate's phone "mate" timed only 25→90 (60.0 s).
 */
const TASK: TaskDefinition = {
  edition: "custom", letter: null, name: "Best three of a minute", kind: "window", workingTimeSec: 300, landingWindowSec: 30,
  launchLimit: null, counting: { rule: "best", n: 3 }, capSec: 60, ladder: null, sumCap: false,
};
const T0 = 1_800_000_000_000;
let n = 0;
const ev = (deviceId: string, recordedBy: string, s: number, body: EventBody): RecordedEvent => {
  n += 1;
  return {
    id: `00000000-0000-7000-8000-${String(n).padStart(12, "0")}`, deviceId, seq: n, recordedBy,
    stamp: { wallMs: T0 + s * 1000, monoMs: s * 1000, pageId: `page-${deviceId}`, offset: null }, body,
  };
};
const flights = (deviceId: string, by: string, list: [number, number][]) =>
  list.flatMap(([a, b]) => [ev(deviceId, by, a, { kind: "launch", lane: 0 }), ev(deviceId, by, b, { kind: "landing", lane: 0 })]);
const events = [
  ev("own", "pilot", 0, { kind: "window-start" }),
  ...flights("own", "pilot", [[2, 22], [25, 90]]),
  ...flights("mate", "mate", [[25, 90]]),
  ev("own", "pilot", 340, { kind: "run-end" }),
];
const result = (standing?: ReadonlyMap<number, string>) =>
  runResult({ task: TASK, createdBy: "pilot", lanes: [{ lane: 0, pilotUserId: "pilot" }], officials: new Set(), events, estimatesByDevice: new Map(), standing }).lanes[0]!;

describe("a record chosen by hand (standing)", () => {
  it("the conflict rules pick the pilot's own record: 80.0 s", () => {
    expect(result().resultTenths).toBe(800);
    expect(result().derived.source?.deviceId).toBe("own");
  });

  it("the chosen record stands: 60.0 s, its flight only, and the versions say which is chosen", () => {
    const lane = result(new Map([[0, "mate"]]));
    expect(lane.resultTenths).toBe(600);
    expect(lane.derived.source?.deviceId).toBe("mate");
    expect(lane.derived.flights.map((f) => f.timeTenths)).toEqual([650]);
    expect(lane.derived.versions.map((v) => [v.deviceId, v.chosen, v.resultTenths])).toEqual([["mate", true, 600], ["own", false, 800]]);
  });

  it("a device that did not record the lane, or another lane, changes nothing", () => {
    expect(result(new Map([[0, "elsewhere"]]))).toEqual(result());
    expect(result(new Map([[1, "mate"]]))).toEqual(result());
  });
});
