import { describe, expect, it } from "vitest";
import { classCautions } from "@/lib/hangar/limits";
import { modelAt, modelStats } from "@/lib/hangar/stats";

const A = "model-a";
const B = "model-b";

describe("class-limit cautions (F3K.2.1: span ≤ 1500 mm, mass ≤ 600 g)", () => {
  it("cautions over the limits and not at them", () => {
    expect(classCautions({ spanMm: 1500, massG: 600 })).toEqual([]);
    expect(classCautions({ spanMm: 1501, massG: 601 })).toHaveLength(2);
    expect(classCautions({ spanMm: 1490, massG: 640 })[0]).toMatch(/640 g is over the class limit of 600 g/);
  });
});

describe("a model's record (lib/hangar/stats.ts)", () => {
  const lane = {
    taskCode: "A",
    // launches at 10 s, 100 s, 200 s; swapped to B at 150 s
    flights: [
      { index: 0, launchAtMs: 10_000, landAtMs: 70_000, timeTenths: 600 },
      { index: 1, launchAtMs: 100_000, landAtMs: 140_000, timeTenths: 400 },
      { index: 2, launchAtMs: 200_000, landAtMs: 290_000, timeTenths: 900 },
    ],
    choices: [{ atMs: 0, modelId: A }, { atMs: 150_000, modelId: B }],
    heights: new Map([[0, 52.5], [1, 48], [2, 61]]),
    // the ground time before each flight, as the Season stores it (lane_flights.ground_ms)
    groundMs: new Map([[1, 30_000], [2, 60_000]]),
  };

  it("the model at an instant is the latest choice before it", () => {
    expect(modelAt(lane.choices, 149_999)).toBe(A);
    expect(modelAt(lane.choices, 150_000)).toBe(B);
    expect(modelAt(lane.choices, -1)).toBeNull();
  });

  it("counts only the flights launched with the model", () => {
    const a = modelStats(A, [lane]);
    expect(a).toMatchObject({ flights: 2, launches: 2, medianLaunchM: 50.25, bestLaunchM: 52.5, medianTurnaroundMs: 30_000, lastFlownMs: 140_000 });
    expect(a.medianTimeByTask).toEqual([{ taskCode: "A", medianTenths: 500, flights: 2 }]);
    const b = modelStats(B, [lane]);
    expect(b).toMatchObject({ flights: 1, bestLaunchM: 61, medianTurnaroundMs: null });
  });

  it("a turnaround is the stored ground time, counted only when both flights flew the model", () => {
    // flight 2's ground time is absent (none counts, e.g. a launch recorded before the landing): no turnaround for B, none made up
    expect(modelStats(A, [{ ...lane, groundMs: new Map([[1, 2_400]]) }]).medianTurnaroundMs).toBe(2_400);
    expect(modelStats(A, [{ ...lane, groundMs: new Map() }]).medianTurnaroundMs).toBeNull();
  });

  it("of two choices at the same instant the last listed counts (the SQL side orders them by time, then id)", () => {
    expect(modelAt([{ atMs: 5, modelId: A }, { atMs: 5, modelId: B }], 5)).toBe(B);
  });

  it("a model never flown has an empty record", () => {
    expect(modelStats("other", [lane])).toMatchObject({ flights: 0, launches: 0, medianLaunchM: null, lastFlownMs: null });
  });
});
