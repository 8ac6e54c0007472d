import { describe, expect, it } from "vitest";
import { getCatalogueTask } from "@/lib/tasks";
import { placeEvents, placeStamp, runResult } from "@/lib/results";
import { stored } from "../field/helpers";

const N = getCatalogueTask("N");
const mine = (e: ReturnType<typeof stored>) => ({ ...e, recordedBy: "pilot" });
const noEstimates = new Map();

describe("placeEvents (SYNC.md §4)", () => {
  it("keeps the steady clock's distances inside one page lifetime; the wall clock only places the first event", () => {
    const start = mine(stored({ kind: "window-start" }, { wallMs: 1_000_000, monoMs: 5_000 }));
    // The wall clock was stepped back 532.3 s during the flight: the steady clock says 569.5 s.
    const launch = mine(stored({ kind: "launch", lane: 0 }, { wallMs: 1_001_000, monoMs: 6_000 }));
    const landing = mine(stored({ kind: "landing", lane: 0 }, { wallMs: 1_001_000 + 569_500 - 532_300, monoMs: 6_000 + 569_500 }));
    const { events, steps } = placeEvents([start, launch, landing], noEstimates);
    expect(events.map((e) => e.correctedMs)).toEqual([1_000_000, 1_001_000, 1_001_000 + 569_500]);
    expect(steps).toEqual([{ deviceId: "device-a", fromEventId: launch.id, toEventId: landing.id, monoMs: 569_500, wallMs: 37_200 }]);
  });

  it("places another page lifetime (a reload) and another device by their own corrected stamps (offset = server − device)", () => {
    const offset = { thetaMs: 2000, deltaMs: 10, measuredAtWallMs: 899_000 };
    const a = mine(stored({ kind: "launch", lane: 0 }, { wallMs: 900_000, monoMs: 1, pageId: "page-0" }));
    const b = mine(stored({ kind: "landing", lane: 0 }, { wallMs: 960_000, monoMs: 1, pageId: "page-1" }));
    const c = { ...stored({ kind: "landing", lane: 1 }, { wallMs: 900_000, monoMs: 7, offset }, "device-b"), recordedBy: "mate" };
    const { events } = placeEvents([a, b, c], noEstimates);
    expect(events.map((e) => e.correctedMs)).toEqual([900_000, 960_000, 902_000]);
  });

  it("applies the device's clock offset to its own events too (the field used to ignore it)", () => {
    const offset = { thetaMs: -30_000, deltaMs: 10, measuredAtWallMs: 999_000 };
    const e = mine(stored({ kind: "window-start" }, { wallMs: 1_000_000, offset }));
    expect(placeEvents([e], noEstimates).events[0]!.correctedMs).toBe(970_000);
  });

  it("keeps a correction relative to the event it corrects", () => {
    const landing = mine(stored({ kind: "landing", lane: 0 }, { wallMs: 939_600, monoMs: 440_000 }));
    const fix = mine(stored({ kind: "correct", targetId: landing.id, wallMs: 939_700 }, { wallMs: 990_000, monoMs: 490_000 }));
    const offset = new Map([["device-a", [{ thetaMs: 400, deltaMs: 10, measuredAtWallMs: 939_000 }]]]);
    const [, placedFix] = placeEvents([landing, fix], offset).events;
    expect(placedFix?.body).toEqual({ kind: "correct", targetId: landing.id, wallMs: 940_100 });
  });

  it("places 'now' on the same timeline as the page's events (steady clock from the page's first event)", () => {
    const start = mine(stored({ kind: "window-start" }, { wallMs: 1_000_000, monoMs: 5_000 }));
    // the wall clock has since jumped an hour ahead; the steady clock says 10 s have passed
    const now = { wallMs: 1_000_000 + 3_600_000, monoMs: 15_000, pageId: "page-1", offset: null };
    expect(placeStamp([start], noEstimates, "device-a", now)).toBe(1_010_000);
    expect(placeStamp([start], noEstimates, "device-a", { ...now, pageId: "page-9" })).toBe(1_000_000 + 3_600_000);
  });
});

describe("runResult: a wall-clock jump during a run", () => {
  it("scores the flight by the steady clock and flags the lane with both times", () => {
    const start = mine(stored({ kind: "window-start" }, { wallMs: 1_000_000, monoMs: 5_000 }));
    const launch = mine(stored({ kind: "launch", lane: 0 }, { wallMs: 1_001_000, monoMs: 6_000 }));
    const landing = mine(stored({ kind: "landing", lane: 0 }, { wallMs: 1_001_000 + 37_200, monoMs: 6_000 + 569_500 }));
    const { lanes } = runResult({
      task: N, createdBy: "pilot", lanes: [{ lane: 0, pilotUserId: "pilot" }], officials: new Set(), events: [start, launch, landing], estimatesByDevice: noEstimates,
    });
    // Task N counts the best flight up to 599 s (RULES.md F3K.11 table): 569.5 s, not 37.2 s.
    expect(lanes[0]!.resultTenths).toBe(5695);
    expect(lanes[0]!.needsReview).toBe(true);
    expect(lanes[0]!.derived.clock).toEqual([{ deviceId: "device-a", flightIndex: 0, monoTenths: 5695, wallTenths: 372 }]);
    expect(lanes[0]!.reviewReason).toContain("Flight 1: 569.5 s by the phone's steady clock, 37.2 s by its wall clock");
  });

  it("raises no flag when the clocks agree", () => {
    const start = mine(stored({ kind: "window-start" }, { wallMs: 1_000_000 }));
    const launch = mine(stored({ kind: "launch", lane: 0 }, { wallMs: 1_001_000 }));
    const landing = mine(stored({ kind: "landing", lane: 0 }, { wallMs: 1_061_000 }));
    const { lanes } = runResult({
      task: N, createdBy: "pilot", lanes: [{ lane: 0, pilotUserId: "pilot" }], officials: new Set(), events: [start, launch, landing], estimatesByDevice: noEstimates,
    });
    expect(lanes[0]!.resultTenths).toBe(600);
    expect(lanes[0]!.needsReview).toBe(false);
    expect(lanes[0]!.derived.clock).toEqual([]);
  });
});
