import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { coachGrants } from "@/db/schema";
import { getRoster } from "@/db/queries/coach/roster";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { listSeasonFlights } from "@/db/queries/season/tables";
import { getCatalogueTask } from "@/lib/tasks";
import { db, freshUser, getPool } from "./support/db";
import { seasonRun } from "./support/season-records";

afterAll(async () => {
  await getPool().end();
});

/**
 * Turnaround (db/queries/season/turnaround.ts) is the ground time a pilot chooses: from a landing to
 * the next launch in a window. In task C every attempt is launched at its own start signal (RULES.md,
 * F3K.11 "Task C details": all pilots launch within 3 s of the signal, 60 s preparation between
 * attempts), so the time from one attempt's landing to the next launch is the wait for the signal,
 * not a turnaround the pilot practises to cut (common practice). Hand-made example: one window of the
 * custom best-three task with a landing at 1:00.0 and a relaunch at 1:02.4 (2.4 s), and one task C
 * run of three attempts (signals at 0, 300 and 600 s). Each attempt's times are stored from its own
 * signal, so the stored ground time before attempt 2 — launched 10 s after its signal, 5 s after the
 * first attempt landed on its own clock — is +5.0 s, which counted as a turnaround before.
 */
describe("turnaround leaves out tasks whose flights each start on a signal (task C)", () => {
  it("counts only the window's 2.4 s in the Season's charts, its flights table and the coach's roster", async () => {
    const pilot = await freshUser("turnaround-signal");
    const coach = await freshUser("turnaround-signal-coach");
    await db.insert(coachGrants).values({ pilotId: pilot.id, coachId: coach.id });
    const windowRun = await seasonRun({ pilotId: pilot.id, at: "2026-05-05T10:00:00Z", flights: [[5, 60], [62.4, 130]] });
    const taskC = getCatalogueTask("C", 3);
    // attempt 1: a 4 s flight; attempt 2: launched 10 s after its signal (it scores zero, F3K.11 "Task C details"); attempt 3 in time
    const cRun = await seasonRun({
      pilotId: pilot.id, at: "2026-05-06T10:00:00Z", task: taskC, signals: [0, 300, 600],
      flights: [[1, 5], [310, 490], [601, 800]],
    });

    const flights = await listSeasonFlights(db, { pilotId: pilot.id, filters: { kind: "all" }, paging: "all" });
    const turnaroundOf = (runId: string) => flights.rows.filter((f) => f.runId === runId).sort((a, b) => a.flight - b.flight).map((f) => f.turnaroundTenths);
    expect(turnaroundOf(windowRun)).toEqual([null, 24]);
    expect(turnaroundOf(cRun)).toEqual([null, null, null]); // the waits for the next signal: not turnaround
    expect(flights.rows.filter((f) => f.runId === cRun).sort((a, b) => a.flight - b.flight).map((f) => f.durationTenths)).toEqual([40, 0, 1990]); // the late launch times nothing
    const stored = await db.execute<{ ground_ms: number | null }>(sql`select ground_ms from lane_flights where run_id = ${cRun} and lane = 0 order by position`);
    expect(stored.rows.map((r) => r.ground_ms)).toEqual([null, 5000, -189000]); // as stored at derive time: 10 s after signal 2 − 5 s after signal 1

    const summary = await getSeasonSummary(db, { pilotId: pilot.id, filters: { kind: "all" }, now: new Date("2026-05-20T12:00:00Z") });
    expect(summary.turnaroundByWeek).toEqual([{ week: "2026-05-04", count: 1, medianTenths: 24, p90Tenths: 24 }]);
    expect(summary.months.this.turnaroundTenths).toBe(24);
    const onlyC = await getSeasonSummary(db, { pilotId: pilot.id, filters: { kind: "all", task: "C" }, now: new Date("2026-05-20T12:00:00Z") });
    expect(onlyC.totals).toEqual({ runs: 1, flights: 3 });
    expect(onlyC.turnaroundByWeek).toEqual([]);
    expect(onlyC.months.this.turnaroundTenths).toBeNull();

    const roster = await getRoster(db, coach.id, new Date("2026-05-20T12:00:00Z"));
    expect(roster.find((p) => p.pilotId === pilot.id)!.turnaround.recent).toBeCloseTo(2.4, 5);
  });
});
