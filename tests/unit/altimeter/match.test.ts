import { describe, expect, it } from "vitest";
import { matchLaunches } from "@/lib/altimeter/match";

const launch = (atMs: number, heightM = 40) => ({ atMs, peakMs: atMs + 3000, heightM, groundM: 0 });
const T = 1_750_000_000_000;

describe("matching detected launches to the run's launch events (lib/altimeter/match.ts)", () => {
  it("pairs launches across a constant clock difference and reports the gap", () => {
    const found = [launch(T + 95_000), launch(T + 195_400), launch(T + 330_000)]; // logger 95 s ahead
    const events = [{ id: "a", atMs: T }, { id: "b", atMs: T + 100_000 }, { id: "c", atMs: T + 235_000 }];
    const { offsetMs, launches } = matchLaunches(found, events);
    expect(offsetMs).toBe(-95_000);
    expect(launches.map((l) => l.eventId)).toEqual(["a", "b", "c"]);
    expect(launches.map((l) => l.gapMs)).toEqual([95_000, 95_400, 95_000]);
    expect(launches[1]!.correctedMs).toBe(T + 100_400);
  });

  it("lists a launch the run has no event for as unmatched", () => {
    const found = [launch(T + 1000), launch(T + 50_000), launch(T + 120_000)];
    const { launches } = matchLaunches(found, [{ id: "a", atMs: T }, { id: "c", atMs: T + 119_000 }]);
    expect(launches.map((l) => l.eventId)).toEqual(["a", null, "c"]);
    expect(launches[1]!.gapMs).toBeNull();
  });

  it("does not guess: one launch far from the only event stays unmatched", () => {
    const { launches } = matchLaunches([launch(T + 300_000)], [{ id: "a", atMs: T }]);
    expect(launches[0]!.eventId).toBeNull();
  });

  it("one event takes one launch, the nearest", () => {
    const { launches } = matchLaunches([launch(T - 1500), launch(T + 300)], [{ id: "a", atMs: T }]);
    expect(launches.map((l) => l.eventId)).toEqual([null, "a"]);
  });
});
