import { describe, expect, it } from "vitest";
import { foldRun, getCatalogueTask } from "@/lib/tasks";
import { eventLog } from "./helpers";

// Task G: the five longest flights count, up to 120 s each (RULES.md F3K.11 table).
const G = getCatalogueTask("G");

/** Three flights of 50, 60 and 70 s; returns the launch ids and the events of flight 2. */
function threeFlights() {
  const log = eventLog();
  log.start(0);
  const launches: string[] = [];
  const flight2: string[] = [];
  for (const [i, [from, to]] of [[1_000, 51_000], [52_000, 112_000], [113_000, 183_000]].entries()) {
    const launch = log.launch(from!);
    const land = log.land(to!);
    launches.push(launch);
    if (i === 1) flight2.push(launch, land);
  }
  return { log, launches, flight2 };
}

describe("invalid marks name the flight by its launch (a flight marked invalid scores zero, F3K.6.2 / F3K.2.2)", () => {
  it("an undo of an earlier flight does not move the mark to another flight", () => {
    const { log, launches, flight2 } = threeFlights();
    log.add(190_000, { kind: "invalid", lane: 0, flightId: launches[2], reason: "landing-outside-field" });
    // the timekeeper then undoes flight 2 (its landing, then its launch)
    log.add(191_000, { kind: "void", targetId: flight2[1]! });
    log.add(192_000, { kind: "void", targetId: flight2[0]! });
    const lane = foldRun(G, log.events).lanes[0]!;
    expect(lane.flights.map((f) => [f.timeTenths, f.markedInvalid])).toEqual([
      [500, null],
      [0, "landing-outside-field"],
    ]);
    expect(lane.flights[1]!.launchId).toBe(launches[2]);
    expect(lane.resultTenths).toBe(500);
  });

  it("a mark recorded by position (older phones) is mapped once to the flight it meant, and stays there after an undo", () => {
    const { log, launches, flight2 } = threeFlights();
    log.add(190_000, { kind: "invalid", lane: 0, flightIndex: 2, reason: "part-lost" });
    log.add(191_000, { kind: "void", targetId: flight2[1]! });
    log.add(192_000, { kind: "void", targetId: flight2[0]! });
    const lane = foldRun(G, log.events).lanes[0]!;
    expect(lane.flights.map((f) => f.markedInvalid)).toEqual([null, "part-lost"]);
    expect(lane.flights[1]!.launchId).toBe(launches[2]);
  });

  it("a mark by position with no undo still names that position", () => {
    const { log } = threeFlights();
    log.add(190_000, { kind: "invalid", lane: 0, flightIndex: 1, reason: "other" });
    expect(foldRun(G, log.events).lanes[0]!.flights.map((f) => f.markedInvalid)).toEqual([null, "other", null]);
  });

  it("a penalty keeps the launch it was given in", () => {
    const { log, launches } = threeFlights();
    log.add(190_000, { kind: "penalty", lane: 0, points: 100, reason: "touched the ground in the safety area", launchId: launches[1] });
    // F3K.4.3: −100 for touching an object in a safety area
    expect(foldRun(G, log.events).lanes[0]!.penaltyPoints).toBe(100);
  });
});

describe("the invalid event's shape (lib/events/schema.ts, ours)", () => {
  it("names its flight by launch id, or by position for older events, and not by neither", async () => {
    const { eventBodySchema } = await import("@/lib/events/schema");
    const id = "00000000-0000-7000-8000-000000000001";
    expect(eventBodySchema.safeParse({ kind: "invalid", lane: 0, flightId: id, reason: "other" }).success).toBe(true);
    expect(eventBodySchema.safeParse({ kind: "invalid", lane: 0, flightIndex: 3, reason: "other" }).success).toBe(true);
    expect(eventBodySchema.safeParse({ kind: "invalid", lane: 0, reason: "other" }).success).toBe(false);
  });
});
