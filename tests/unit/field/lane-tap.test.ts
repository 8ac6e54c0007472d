import { describe, expect, it } from "vitest";
import { flightTimeCorrection, launchTimeCorrection } from "@/lib/field/flight-fix";
import { isRunOpen, tapKindFor, undoTargetFor } from "@/lib/field/lane-tap";
import { placedTimeline } from "@/lib/offline/run-result";
import { getCatalogueTask, liveState, type TimelineEvent } from "@/lib/tasks";
import { eventLog } from "../tasks/helpers";
import { stored } from "./helpers";

const H = getCatalogueTask("H");

/** Plays taps on one lane through tapKindFor, as the screen does. */
function tapAll(timesMs: number[], lane = 0, laneCount = 1, events: TimelineEvent[] = []) {
  let n = events.length;
  for (const at of timesMs) {
    const kind = tapKindFor(events, lane, laneCount);
    events.push({ id: `00000000-0000-7000-8000-${String(++n).padStart(12, "0")}`, atMs: at, body: { kind, lane } });
  }
  return events;
}

describe("tapKindFor", () => {
  it("toggles launch and landing; a landing and a relaunch 0.3 s apart both count (RULES.md, common practice)", () => {
    const events: TimelineEvent[] = [{ id: "00000000-0000-7000-8000-000000000000", atMs: 0, body: { kind: "window-start" } }];
    // F3K.11.8 example flights 63, 239, 182, 90 s, each relaunch 0.3 s after the landing.
    tapAll([0, 63_000, 63_300, 302_300, 302_600, 484_600, 484_900, 574_900], 0, 1, events);
    expect(events.slice(1).map((e) => e.body.kind)).toEqual(["launch", "landing", "launch", "landing", "launch", "landing", "launch", "landing"]);
    const state = liveState(H, events, 590_000, { laneCount: 1 });
    expect(state.lanes[0]?.flights.map((f) => f.timeTenths)).toEqual([630, 2390, 1820, 900]);
    // F3K.11.8: 60 + 239 + 180 + 90 = 569 s.
    expect(state.lanes[0]?.resultTenths).toBe(5690);
  });
  it("keeps lanes apart", () => {
    const events: TimelineEvent[] = [{ id: "00000000-0000-7000-8000-000000000000", atMs: 0, body: { kind: "window-start" } }];
    tapAll([1000], 0, 2, events);
    expect(tapKindFor(events, 1, 2)).toBe("launch");
    expect(tapKindFor(events, 0, 2)).toBe("landing");
  });
});

describe("undoTargetFor", () => {
  it("takes the lane's latest tap, then the one before once that is voided", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000);
    const land = log.land(5000);
    expect(undoTargetFor(log.events, 0)?.id).toBe(land);
    log.add(6000, { kind: "void", targetId: land });
    expect(undoTargetFor(log.events, 0)?.body.kind).toBe("launch");
  });
  it("offers the working-time start only when no lane has tapped", () => {
    const log = eventLog();
    const start = log.start(0);
    expect(undoTargetFor(log.events, 0)?.id).toBe(start);
    log.launch(1000, 1);
    expect(undoTargetFor(log.events, 0)).toBeNull();
  });
});

describe("flightTimeCorrection", () => {
  it("moves the landing so the flight scores exactly the typed time", () => {
    const ctx = { deviceId: "device-a", me: null, estimate: null };
    const start = stored({ kind: "window-start" }, { wallMs: 1_000_000.25 });
    const launch = stored({ kind: "launch", lane: 0 }, { wallMs: 1_001_000.7 });
    const landing = stored({ kind: "landing", lane: 0 }, { wallMs: 1_064_000.3 });
    const events = [start, launch, landing];
    const body = flightTimeCorrection(placedTimeline(events, ctx), events, 0, 0, 1, 598);
    expect(body?.targetId).toBe(landing.id);
    const fixed = [...events, stored(body!, { wallMs: 1_900_000 })];
    const state = liveState(H, placedTimeline(fixed, ctx), 2_000_000, { laneCount: 1 });
    expect(state.lanes[0]?.flights[0]?.timeTenths).toBe(598);
  });
  it("refuses a flight still in the air", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000);
    expect(flightTimeCorrection(log.events, [], 0, 0, 1, 100)).toBeNull();
  });
});

describe("launchTimeCorrection", () => {
  const ctx = { deviceId: "device-a", me: null, estimate: null };
  const start = stored({ kind: "window-start" }, { wallMs: 1_000_000.25 });
  const launch1 = stored({ kind: "launch", lane: 0 }, { wallMs: 1_001_000.7 });
  const land1 = stored({ kind: "landing", lane: 0 }, { wallMs: 1_064_000.3 });
  const launch2 = stored({ kind: "launch", lane: 0 }, { wallMs: 1_070_000 });
  const land2 = stored({ kind: "landing", lane: 0 }, { wallMs: 1_100_000 });
  const events = [start, launch1, land1, launch2, land2];

  it("moves the launch to the typed working time and keeps the landing: the flight time follows", () => {
    // Launch typed as 0:02.5 into working time, landing 64.00005 s after the signal: 61.50005 s → 61.5 s (F3K.7 tenths).
    const fix = launchTimeCorrection(placedTimeline(events, ctx), events, 0, 0, 1, 25);
    if (!("body" in fix)) throw new Error(fix.error);
    expect(fix.body.targetId).toBe(launch1.id);
    const fixed = [...events, stored(fix.body, { wallMs: 1_900_000 })];
    const state = liveState(H, placedTimeline(fixed, ctx), 2_000_000, { laneCount: 1 });
    expect(state.lanes[0]?.flights[0]?.launchMs).toBe(2500);
    expect(state.lanes[0]?.flights[0]?.timeTenths).toBe(615);
    expect(state.lanes[0]?.flights[1]?.timeTenths).toBe(300);
  });

  it("refuses a launch at or after its own landing, or before the lane's previous landing", () => {
    const timeline = placedTimeline(events, ctx);
    expect(launchTimeCorrection(timeline, events, 0, 0, 1, 641)).toEqual({ error: "The launch must come before this flight's landing." });
    expect(launchTimeCorrection(timeline, events, 0, 1, 1, 600)).toEqual({ error: "The launch must come after the previous flight's landing." });
    expect(launchTimeCorrection(timeline, events, 0, 5, 1, 10)).toEqual({ error: "There is no such flight to correct." });
  });
});

describe("isRunOpen", () => {
  it("is open until a run-end that is not undone", () => {
    const end = stored({ kind: "run-end" }, { wallMs: 10 });
    expect(isRunOpen([stored({ kind: "window-start" }, { wallMs: 0 })])).toBe(true);
    expect(isRunOpen([end])).toBe(false);
    expect(isRunOpen([end, stored({ kind: "void", targetId: end.id }, { wallMs: 20 })])).toBe(true);
  });
});
