import { describe, expect, it } from "vitest";
import { foldRun, getCatalogueTask, pointsLost, type TaskLetter } from "@/lib/tasks";
import { eventLog } from "./helpers";

function lost(letter: TaskLetter, flights: [number, number][], extra?: (log: ReturnType<typeof eventLog>) => void) {
  const def = getCatalogueTask(letter);
  const log = eventLog();
  log.start(0);
  for (const [a, b] of flights) log.flight(a, b);
  extra?.(log);
  return pointsLost(def, foldRun(def, log.events).lanes[0]!);
}

const sum = (p: Record<string, number>) => Object.values(p).reduce((a, b) => a + b, 0);

describe("points-lost breakdown", () => {
  it("task H published flights (F3K.11.8): 27 s lost = 5 s over targets + 22 s on the ground", () => {
    // 63, 239, 182, 90 flown back to back from 0 with 1 s gaps: airtime 574 s, ground 26 s.
    // max 596; scored 569; lost 27. Over: 63−60 + 182−180 = 5. Ground 26 − 4 allowed = 22.
    const b = lost("H", [[0, 63_000], [64_000, 303_000], [304_000, 486_000], [487_000, 577_000]]);
    expect(b).toMatchObject({ maxTenths: 5960, scoredTenths: 5690, lostTenths: 270, windowBound: true });
    expect(b.parts).toEqual({ invalid: 0, notCounted: 0, overCap: 50, shortOfTarget: 0, groundTime: 220, roundZero: 0 });
  });
  it("task A (slot-limited): a last flight of 250 s lost 50 s short of its cap", () => {
    const b = lost("A", [[0, 100_000], [101_000, 351_000]]);
    expect(b.windowBound).toBe(false);
    expect(b.parts).toEqual({ invalid: 0, notCounted: 0, overCap: 0, shortOfTarget: 500, groundTime: 0, roundZero: 0 });
  });
  it("task B: an invalid counted flight loses its whole cap; places not flown lose theirs", () => {
    // B: flights 200 and 230 (marked invalid): 200 counted (40 short), 230 invalid (240 lost).
    const b = lost("B", [[0, 200_000], [201_000, 431_000]], (log) => log.add(440_000, { kind: "invalid", lane: 0, flightIndex: 1, reason: "part-lost" }));
    expect(b.parts).toEqual({ invalid: 2400, notCounted: 0, overCap: 0, shortOfTarget: 400, groundTime: 0, roundZero: 0 });
    const none = lost("B", []);
    expect(none.parts.shortOfTarget).toBe(4800);
  });
  it("task K: waiting after the fifth launch is short of target, not ground time", () => {
    // 5 flights of 60 s back to back, 1 s apart: 60+60+60+60+60 = 300 (last four short).
    const flights: [number, number][] = [0, 1, 2, 3, 4].map((i) => [i * 61_000, i * 61_000 + 60_000]);
    const b = lost("K", flights);
    expect(b.lostTenths).toBe(5950 - 3000);
    // Idle from 304 s to 600 s = 296 s; the 4 s of gaps are within the 5 s F3K.7 allows, so
    // all 295 s lost (max 595 − 300) go to short of target, none to ground time.
    expect(b.parts).toEqual({ invalid: 0, notCounted: 0, overCap: 0, shortOfTarget: 2950, groundTime: 0, roundZero: 0 });
  });
  it("task G: airtime of a sixth, uncounted flight is reported as not counted", () => {
    const flights: [number, number][] = [0, 1, 2, 3, 4, 5].map((i) => [i * 100_000, i * 100_000 + 90_000]);
    const b = lost("G", flights);
    // scored 5 × 90 = 450; lost 145: 90 not counted, the rest ground (60 s − 5 s allowed).
    expect(b.parts).toEqual({ invalid: 0, notCounted: 900, overCap: 0, shortOfTarget: 0, groundTime: 550, roundZero: 0 });
  });
  it("reports penalties beside the seconds", () => {
    const b = lost("G", [], (log) => log.add(1000, { kind: "penalty", lane: 0, points: 100, reason: "safety area" }));
    expect(b.penaltyPoints).toBe(100);
    expect(sum(b.parts)).toBe(b.lostTenths);
  });
});
