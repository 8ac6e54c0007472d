import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getSeasonSummary } from "@/db/queries/season/summary";
import type { SeasonSummary } from "@/lib/season/types";
import { db, freshUser, getPool } from "./support/db";
import { LADDER, seasonRun } from "./support/season-records";

/**
 * Each aggregate of the Season screen against numbers worked out by hand. The aggregates run in
 * SQL (db/queries/season), so these run against the real PostgreSQL. The pilot's season:
 * - week of Mon 1 June: run 1 (best three of 60 s): 5.0→60.0, 62.4→130.0, 135.0→180.0
 *   (flights 55.0, 67.6 credited 60.0, 45.0 → 160.0 of 180.0; ground 2.4 s and 5.0 s);
 *   run 2 (ladder 30 s, 60 s): 3.0→35.0, 40.0→95.0 (32.0 over by 2.0; 55.0 under by 5.0 →
 *   85.0 of 90.0; ground 5.0 s);
 * - week of Mon 8 June: run 3 (best three): 10.0→40.0, 43.0→100.0 (30.0 + 57.0 = 87.0; ground 3.0 s);
 * - a run someone else recorded for the pilot and they did not accept: never counted.
 */
let summary: SeasonSummary;
let pilotId: string;

beforeAll(async () => {
  const pilot = await freshUser("season-agg");
  const keeper = await freshUser("season-keeper");
  pilotId = pilot.id;
  await seasonRun({ pilotId, at: "2026-06-02T10:00:00Z", flights: [[5, 60], [62.4, 130], [135, 180]] });
  await seasonRun({ pilotId, at: "2026-06-03T10:00:00Z", flights: [[3, 35], [40, 95]], task: LADDER });
  await seasonRun({ pilotId, at: "2026-06-09T10:00:00Z", flights: [[10, 40], [43, 100]] });
  await seasonRun({ pilotId, at: "2026-06-10T10:00:00Z", flights: [[1, 2], [3, 4]], recordedBy: keeper.id });
  summary = await getSeasonSummary(db, { pilotId, filters: { kind: "all" }, now: new Date("2026-06-20T12:00:00Z") });
});

afterAll(async () => {
  await getPool().end();
});

describe("season aggregates (hand-computed)", () => {
  it("counts the pilot's own runs and their flights, not a run waiting for their decision", () => {
    expect(summary.totals).toEqual({ runs: 3, flights: 7 });
  });

  it("turnaround: landing at 1:00.0, relaunch at 1:02.4 is 2.4 s; median and 90th percentile per week; trend per week", () => {
    expect(summary.turnaroundByWeek).toEqual([
      // ground times 2.4, 5.0, 5.0 s: median 5.0; 90th percentile 5.0
      { week: "2026-06-01", count: 3, medianTenths: 50, p90Tenths: 50 },
      { week: "2026-06-08", count: 1, medianTenths: 30, p90Tenths: 30 },
    ]);
    expect(summary.turnaroundTrend).toBe(-20); // 5.0 s → 3.0 s in one week
  });

  it("result as a share of the task's maximum, per task and week", () => {
    expect(summary.shareByWeek.map((s) => ({ ...s, share: Math.round(s.share * 10_000) / 10_000 }))).toEqual([
      { week: "2026-06-01", task: "custom", share: Math.round(((1600 / 1800 + 850 / 900) / 2) * 10_000) / 10_000, runs: 2 },
      { week: "2026-06-08", task: "custom", share: Math.round((870 / 1800) * 10_000) / 10_000, runs: 1 },
    ]);
  });

  it("target accuracy: over and under each target", () => {
    expect(summary.targets).toEqual([
      { targetSec: 30, flights: 1, over: 1, under: 0, meanOverTenths: 20, meanUnderTenths: 0 },
      { targetSec: 60, flights: 1, over: 0, under: 1, meanOverTenths: 0, meanUnderTenths: 50 },
    ]);
  });

  it("flight durations in 30-second bins", () => {
    // 55.0, 45.0, 32.0, 55.0, 30.0, 57.0 in [30, 60); 67.6 in [60, 90)
    expect(summary.durations).toEqual([
      { fromSec: 30, toSec: 60, flights: 6 },
      { fromSec: 60, toSec: 90, flights: 1 },
    ]);
  });

  it("launches per window, per week", () => {
    expect(summary.launchesByWeek).toEqual([
      { week: "2026-06-01", windows: 2, launches: 5 },
      { week: "2026-06-08", windows: 1, launches: 2 },
    ]);
  });

  it("points lost by cause per week add up to max − result", () => {
    const [w1, w2] = summary.lostByWeek;
    const lost = (w: NonNullable<typeof w1>) => w.groundTime + w.overCap + w.shortOfTarget + w.invalid + w.notCounted + w.roundZero;
    expect(lost(w1!)).toBe(1800 - 1600 + (900 - 850));
    expect(lost(w2!)).toBe(1800 - 870);
    // run 1 is short by 5.0 + 0 + 15.0 s, run 2 by 5.0 s on its 60 s step; run 3 by 30.0 + 3.0 s and a place never flown (60.0 s)
    expect(w1).toMatchObject({ shortOfTarget: 250, penaltyPoints: 0 });
    expect(w2).toMatchObject({ shortOfTarget: 930 });
  });

  it("personal bests per task, and this month against last", () => {
    expect(summary.bests).toEqual([expect.objectContaining({ task: "custom", resultTenths: 1600, maxTenths: 1800, day: "2026-06-02" })]);
    expect(summary.months.this).toMatchObject({ start: "2026-06-01", runs: 3, flights: 7, turnaroundTenths: 40 });
    expect(summary.months.last).toEqual({ start: "2026-05-01", runs: 0, flights: 0, share: null, turnaroundTenths: null });
  });

  it("filters by date, task and field", async () => {
    const week2 = await getSeasonSummary(db, { pilotId, filters: { kind: "all", from: "2026-06-08", to: "2026-06-09" }, now: new Date("2026-06-20T12:00:00Z") });
    expect(week2.totals).toEqual({ runs: 1, flights: 2 });
    const letterA = await getSeasonSummary(db, { pilotId, filters: { kind: "all", task: "A" }, now: new Date("2026-06-20T12:00:00Z") });
    expect(letterA.totals).toEqual({ runs: 0, flights: 0 });
    const elsewhere = await getSeasonSummary(db, { pilotId, filters: { kind: "all", field: "Elsewhere" }, now: new Date("2026-06-20T12:00:00Z") });
    expect(elsewhere.totals.runs).toBe(0);
  });
});
