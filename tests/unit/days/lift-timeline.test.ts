import { describe, expect, it } from "vitest";
import {
  QUARTER_HOUR_MS,
  bestQuarter,
  buildLiftTimeline,
  flightLift,
} from "@/lib/days/lift-timeline";
import { median } from "@/lib/hangar/stats";

// A hand-made day starting 10:00 UTC on 2026-06-06.
const T0 = Date.UTC(2026, 5, 6, 10, 0, 0);
const at = (minutes: number) => T0 + minutes * 60_000;
const s = (seconds: number) => seconds * 1000;

// Pilot A: 60, 90, 120 s → median 90 s.  Pilot B: 30, 40, 50, 80 s → median 45 s.
const day = [
  { pilotId: "a", launchedAtMs: at(2), durationMs: s(60) }, // 10:00 bin, under median → 0
  { pilotId: "b", launchedAtMs: at(14), durationMs: s(30) }, // 10:00 bin → 0
  { pilotId: "a", launchedAtMs: at(31), durationMs: s(120) }, // 10:30 bin → (120-90)/90 = 1/3
  { pilotId: "b", launchedAtMs: at(44), durationMs: s(80) }, // 10:30 bin → (80-45)/45 = 7/9
  { pilotId: "b", launchedAtMs: at(47), durationMs: s(50) }, // 10:45 bin → (50-45)/45 = 1/9
  { pilotId: "a", launchedAtMs: at(50), durationMs: s(90) }, // 10:45 bin, at median → 0
  { pilotId: "b", launchedAtMs: at(59), durationMs: s(40) }, // 10:45 bin → 0
];

describe("median (the hangar's, which the lift timeline uses)", () => {
  it("takes the middle of an odd list and the mean of the two middles of an even one", () => {
    expect(median([120, 60, 90])).toBe(90);
    expect(median([80, 30, 50, 40])).toBe(45);
    expect(median([])).toBeNull();
  });
});

describe("flightLift", () => {
  it("counts only the part above the pilot's median, as a fraction of it", () => {
    expect(flightLift(120, 90)).toBeCloseTo(1 / 3, 12);
    expect(flightLift(90, 90)).toBe(0);
    expect(flightLift(30, 90)).toBe(0);
    expect(flightLift(30, 0)).toBe(0);
  });
});

describe("buildLiftTimeline on a hand-made day", () => {
  const bins = buildLiftTimeline(day);

  it("lays one bin per quarter hour from the first launch to the last, empty ones included", () => {
    expect(bins.map((b) => b.startMs)).toEqual([at(0), at(15), at(30), at(45)]);
    expect(bins.map((b) => b.flights)).toEqual([2, 0, 2, 3]);
  });

  it("weights each bin by how far its flights beat each pilot's own median", () => {
    const lift = bins.map((b) => b.lift);
    expect(lift[0]).toBe(0);
    expect(lift[1]).toBe(0);
    expect(lift[2]).toBeCloseTo(1 / 3 + 7 / 9, 12); // 10/9
    expect(lift[3]).toBeCloseTo(1 / 9, 12);
  });

  it("scales intensity to the strongest quarter hour", () => {
    const intensity = bins.map((b) => b.intensity);
    expect(intensity[0]).toBe(0);
    expect(intensity[2]).toBe(1);
    expect(intensity[3]).toBeCloseTo(1 / 10, 12); // (1/9) / (10/9)
  });

  it("names 10:30 as the best quarter hour", () => {
    expect(bestQuarter(bins)?.startMs).toBe(at(30));
    expect(at(30) - at(15)).toBe(QUARTER_HOUR_MS);
  });
});

describe("buildLiftTimeline edge cases", () => {
  it("gives nothing for a day without flights and ignores zero or broken flights", () => {
    expect(buildLiftTimeline([])).toEqual([]);
    expect(
      buildLiftTimeline([{ pilotId: "a", launchedAtMs: at(0), durationMs: 0 }]),
    ).toEqual([]);
    expect(
      buildLiftTimeline([{ pilotId: "a", launchedAtMs: Number.NaN, durationMs: s(60) }]),
    ).toEqual([]);
  });

  it("shows still air (no best quarter) when each pilot flew once", () => {
    const bins = buildLiftTimeline([
      { pilotId: "a", launchedAtMs: at(0), durationMs: s(60) },
      { pilotId: "b", launchedAtMs: at(20), durationMs: s(200) },
    ]);
    expect(bins.map((b) => b.lift)).toEqual([0, 0]);
    expect(bins.map((b) => b.intensity)).toEqual([0, 0]);
    expect(bestQuarter(bins)).toBeNull();
  });
});

describe("describeLiftTimeline", () => {
  const hhmm = (ms: number) => new Date(ms).toISOString().slice(11, 16);
  it("says how many flights, over which span, and when the best air came", async () => {
    const { describeLiftTimeline } = await import("@/lib/days/lift-sentence");
    expect(describeLiftTimeline(buildLiftTimeline(day), hhmm)).toBe(
      "7 flights from 10:00 to 10:45, by quarter hour, weighted by how far each flight beat its pilot's usual time; the best air came at 10:30.",
    );
    expect(describeLiftTimeline([], hhmm)).toMatch(/No flights/);
    // one quarter hour: not "from 10:00 to 10:00"; one flight is "1 flight"
    expect(describeLiftTimeline(buildLiftTimeline(day.slice(0, 2)), hhmm)).toBe(
      "2 flights in the quarter hour from 10:00; no flight beat its pilot's usual time, so no quarter hour stands out.",
    );
    expect(describeLiftTimeline(buildLiftTimeline(day.slice(0, 1)), hhmm)).toMatch(/^1 flight in the quarter hour from 10:00;/);
  });
});
