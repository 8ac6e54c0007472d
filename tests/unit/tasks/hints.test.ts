import { describe, expect, it } from "vitest";
import { describeStrip } from "@/components/run/timeline-strip";
import { getCatalogueTask, liveState } from "@/lib/tasks";
import { eventLog } from "./helpers";

const H = getCatalogueTask("H");

/** Flights of 60, 120 and 180 s in task H, then 2:00 of working time left (the case). */
function sixtyOneTwentyOneEighty() {
  const log = eventLog();
  log.start(0);
  log.flight(1_000, 61_000);
  log.flight(62_000, 182_000);
  log.flight(183_000, 363_000);
  return log;
}

describe("task H live hints in the pilot's terms (F3K.11.8: 4 longest flights matched longest → 240, then 180, 120, 60)", () => {
  it("says what each flight length still adds, and only lengths that fit in the time left", () => {
    const log = sixtyOneTwentyOneEighty();
    const lane = liveState(H, log.events, 480_000, { laneCount: 1 }).lanes[0]!; // 2:00 left
    expect(lane.resultTenths).toBe(3600);
    // One more flight of 2:00 makes 180 → 240, 120 → 180, 120 → 120, 60 → 60: 480.0 (+120.0);
    // a flight of 1:00 makes 420.0 (+60.0); 3:00 and 4:00 no longer fit.
    expect(lane.hints).toEqual([
      { sec: 120, gainTenths: 1200 },
      { sec: 60, gainTenths: 600 },
    ]);
  });

  it("says which target each flight is credited to (the engine's matching), on the strip too", () => {
    const log = sixtyOneTwentyOneEighty();
    const lane = liveState(H, log.events, 480_000, { laneCount: 1 }).lanes[0]!;
    expect(lane.flights.map((f) => f.targetSec)).toEqual([120, 180, 240]);
    expect(describeStrip(H, lane.flights)).toContain("flight 3 from 3:03.0 for 180.0 s, counts, for the 4:00 target.");
  });

  it("gives no hint with a model in the air or after working time", () => {
    const log = sixtyOneTwentyOneEighty();
    log.launch(400_000);
    expect(liveState(H, log.events, 410_000, { laneCount: 1 }).lanes[0]!.hints).toEqual([]);
    expect(liveState(H, sixtyOneTwentyOneEighty().events, 700_000, { laneCount: 1 }).lanes[0]!.hints).toEqual([]);
  });
});
