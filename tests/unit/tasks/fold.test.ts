import { describe, expect, it } from "vitest";
import { foldRun, getCatalogueTask } from "@/lib/tasks";
import { eventLog } from "./helpers";

const G = getCatalogueTask("G");

describe("foldRun: pairing launches and landings", () => {
  it("a landing and a launch 0.3 s apart both count — no debouncing (RULES.md, common practice)", () => {
    const log = eventLog();
    log.start(0);
    log.flight(0, 100_000);
    log.flight(100_300, 200_300);
    const lane = foldRun(G, log.events).lanes[0]!;
    expect(lane.flights).toHaveLength(2);
    expect(lane.resultTenths).toBe(2000); // 100 + 100
  });
  it("ignores a landing with no open flight and a launch while a flight is open", () => {
    const log = eventLog();
    log.start(0);
    log.land(500);
    log.launch(1000);
    log.launch(2000);
    log.land(51_000);
    const run = foldRun(G, log.events);
    expect(run.lanes[0]!.flights.map((f) => [f.launchMs, f.landMs])).toEqual([[1000, 51_000]]);
  });
  it("pairs each lane on its own", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000, 0);
    log.launch(1500, 1);
    log.land(61_000, 1);
    log.land(91_000, 0);
    const run = foldRun(G, log.events);
    expect(run.lanes.map((l) => l.resultTenths)).toEqual([900, 595]);
  });
  it("a landing and a launch at the same instant: the landing closes the open flight first", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000);
    log.launch(50_000); // recorded before the landing, same time
    log.land(50_000);
    log.land(80_000);
    expect(foldRun(G, log.events).lanes[0]!.flights.map((f) => f.timeTenths)).toEqual([490, 300]);
  });
});

describe("foldRun: undo and corrections", () => {
  it("void removes an event; voiding the void restores it", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000);
    const land = log.land(31_000);
    log.land(61_000);
    const v = log.add(62_000, { kind: "void", targetId: land });
    expect(foldRun(G, log.events).lanes[0]!.resultTenths).toBe(600);
    log.add(63_000, { kind: "void", targetId: v });
    expect(foldRun(G, log.events).lanes[0]!.resultTenths).toBe(300);
  });
  it("correct moves a timed event; the latest correction wins", () => {
    const log = eventLog();
    log.start(0);
    const launch = log.launch(5000);
    log.land(65_000);
    log.add(70_000, { kind: "correct", targetId: launch, wallMs: 4000 });
    expect(foldRun(G, log.events).lanes[0]!.flights[0]?.timeTenths).toBe(610);
    log.add(71_000, { kind: "correct", targetId: launch, wallMs: 15_000 });
    expect(foldRun(G, log.events).lanes[0]!.flights[0]?.timeTenths).toBe(500);
  });
  it("a corrected window start moves working time", () => {
    const log = eventLog();
    const start = log.start(10_000);
    log.flight(5000, 105_000);
    expect(foldRun(G, log.events).lanes[0]!.resultTenths).toBe(0); // launched before the start
    log.add(106_000, { kind: "correct", targetId: start, wallMs: 4000 });
    expect(foldRun(G, log.events).lanes[0]!.resultTenths).toBe(1000);
  });
  it("a voided correction no longer applies", () => {
    const log = eventLog();
    log.start(0);
    const launch = log.launch(5000);
    log.land(65_000);
    const c = log.add(70_000, { kind: "correct", targetId: launch, wallMs: 25_000 });
    log.add(71_000, { kind: "void", targetId: c });
    expect(foldRun(G, log.events).lanes[0]!.flights[0]?.timeTenths).toBe(600);
  });
  it("is a pure function: the input order of simultaneous-free events does not matter", () => {
    const log = eventLog();
    log.start(0);
    log.flight(1000, 60_000);
    log.flight(61_000, 150_000);
    const forward = foldRun(G, log.events);
    const backward = foldRun(G, [...log.events].reverse());
    expect(backward.lanes[0]!.resultTenths).toBe(forward.lanes[0]!.resultTenths);
  });
});

describe("foldRun: penalties, invalid marks and targets", () => {
  // Ours: a lane is one pilot, so a penalty counts against its own lane only. The points are
  // the rulebook's (F3K.4.3: −100 for touching an object, −300 for a person in the safety area);
  // how several penalties of one lane combine is in penalty-rules.test.ts.
  it("keeps each lane's penalties to that lane's pilot", () => {
    const log = eventLog();
    log.start(0);
    log.add(1000, { kind: "penalty", lane: 0, points: 100, reason: "touched object in safety area" });
    log.add(2000, { kind: "penalty", lane: 1, points: 300, reason: "touched a person" });
    const run = foldRun(G, log.events);
    expect(run.lanes.map((l) => l.penaltyPoints)).toEqual([100, 300]);
  });
  it("an invalid mark refers to the flight index in the lane", () => {
    const log = eventLog();
    log.start(0);
    log.flight(0, 50_000);
    log.flight(51_000, 101_000);
    log.add(102_000, { kind: "invalid", lane: 0, flightIndex: 1, reason: "part-lost" });
    const flights = foldRun(G, log.events).lanes[0]!.flights;
    expect(flights.map((f) => f.zeroReason)).toEqual([null, "marked-invalid"]);
    expect(flights[1]?.markedInvalid).toBe("part-lost");
  });
  it("task E: a target shown right after release applies to the flight in the air", () => {
    const log = eventLog();
    log.start(0);
    log.launch(1000);
    log.add(2000, { kind: "target", lane: 0, targetSec: 30 });
    log.land(40_000);
    expect(foldRun(getCatalogueTask("E"), log.events).lanes[0]!.resultTenths).toBe(300);
  });
  it("task E: the end-call 'airborne-at-end' setting credits nothing if the model lands before the end", () => {
    const def = { ...getCatalogueTask("E"), endCall: "airborne-at-end" as const };
    const log = eventLog();
    log.start(0);
    log.add(400_000, { kind: "end-call", lane: 0 });
    log.flight(400_000, 590_000);
    expect(foldRun(def, log.events).lanes[0]!.resultTenths).toBe(0);
    const flown = foldRun(getCatalogueTask("E"), log.events).lanes[0]!.resultTenths;
    expect(flown).toBe(1900);
  });
});
