import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { getSeasonSummaryJson } from "@/db/queries/season/summary";
import { settleSeasonWeeks, weeklyTurnaroundsKept } from "@/db/queries/season/weeks";
import { getCatalogueTask } from "@/lib/tasks";
import { db, demoUser, freshUser, getPool } from "./support/db";
import { seasonRun } from "./support/season-records";
import { weekTurnaroundsBeside } from "./support/season-week-turnarounds";

/**
 * season_week_turnarounds (db/schema/season-weeks.ts): each pilot's weekly turnaround count, median and 90th
 * percentile, kept by triggers on run_lanes, runs and lane_consents, read by the Season's summary without filters.
 * Checked against the values computed from lane_flights (isTurnaround, percentile_cont) on the seeded pilots and after
 * each kind of write, and the summary read through it against the same summary computed from the lanes.
 */
afterAll(async () => {
  await getPool().end();
});

const now = new Date("2026-12-05T12:00:00Z");
/** The summary without filters (read from season_week_turnarounds) and with a filter that keeps every run (computed from the lanes). */
async function bothSummaries(pilotId: string) {
  return Promise.all([
    getSeasonSummaryJson(db, { pilotId, filters: { kind: "all" }, now }),
    getSeasonSummaryJson(db, { pilotId, filters: { kind: "all", from: "1970-01-01" }, now }),
  ]);
}

describe("season_week_turnarounds", () => {
  it("equals the values computed from lane_flights on the seeded pilots, and the summary reads the same as from the lanes", async () => {
    const ids = await Promise.all(["ada@example.com", "tobi@example.com", "lena@example.com"].map(async (e) => (await demoUser(e)).id));
    const { stored, fromFlights } = await weekTurnaroundsBeside(ids);
    expect(stored.length).toBeGreaterThan(5); // real data: an empty table would equal an empty computation
    expect(stored).toEqual(fromFlights);
    for (const id of ids) {
      const [kept, fromLanes] = await bothSummaries(id);
      expect(kept).toBe(fromLanes);
    }
  });

  it("follows every write: new runs, a re-derivation, consent decisions, a moved run, deleted lanes and runs", async () => {
    const pilot = await freshUser("week-turnarounds");
    const keeper = await freshUser("week-turnarounds-keeper");
    const check = async () => {
      const both = await weekTurnaroundsBeside([pilot.id]);
      expect(both.stored).toEqual(both.fromFlights);
      const [kept, fromLanes] = await bothSummaries(pilot.id);
      expect(kept).toBe(fromLanes);
      return both.stored.map(([, week, n, median, p90]) => [week, n, median, p90]);
    };
    // hand-computed (Tuesday 2026-05-05, week of Monday 2026-05-04): landings at 37 s and 95 s, relaunches at 40 s and
    // 99 s: 3.0 s and 4.0 s on the ground; median 3.5 s, 90th percentile 3.0 + 0.9 × (4.0 − 3.0) = 3.9 s
    const first = await seasonRun({ pilotId: pilot.id, at: "2026-05-05T10:00:00Z", flights: [[5, 37], [40, 95], [99, 150]] });
    expect(await check()).toEqual([["2026-05-04", 2, 3500, 3900]]);
    // the same week: 20 s → 22 s is 2.0 s; {2.0, 3.0, 4.0}: median 3.0 s, 90th percentile 3.0 + 0.8 × 1.0 = 3.8 s
    const second = await seasonRun({ pilotId: pilot.id, at: "2026-05-07T10:00:00Z", flights: [[5, 20], [22, 60]] });
    expect(await check()).toEqual([["2026-05-04", 3, 3000, 3800]]);
    // a task C run (launched on signals) counts no turnaround (F3K.11 "Task C details"; turnaround.ts)
    await seasonRun({ pilotId: pilot.id, at: "2026-05-08T10:00:00Z", task: getCatalogueTask("C"), signals: [0, 300], flights: [[3, 60], [303, 350]] });
    expect(await check()).toEqual([["2026-05-04", 3, 3000, 3800]]);
    // a re-derivation stored: the first run's second flight no longer lands, so the 4.0 s turnaround is gone
    await db.execute(sql`update run_lanes set derived = jsonb_set(derived, '{flights,1,landMs}', 'null') where run_id = ${first}::uuid`);
    expect(await check()).toEqual([["2026-05-04", 2, 2500, 2900]]);
    // a lane that loses its result leaves its week, and counts again once it has one (the old row's week and the new row's)
    await db.execute(sql`update run_lanes set result_tenths = null where run_id = ${second}::uuid`);
    expect(await check()).toEqual([["2026-05-04", 1, 3000, 3000]]);
    await db.execute(sql`update run_lanes set result_tenths = 500 where run_id = ${second}::uuid`);
    expect(await check()).toEqual([["2026-05-04", 2, 2500, 2900]]);
    // a run recorded by a timekeeper counts once the pilot accepts it, not while pending or hidden (lib/sync/consent.ts)
    const recorded = await seasonRun({ pilotId: pilot.id, at: "2026-05-12T10:00:00Z", flights: [[5, 30], [36, 70]], recordedBy: keeper.id });
    expect(await check()).toEqual([["2026-05-04", 2, 2500, 2900]]);
    await db.execute(sql`insert into lane_consents (run_id, lane, pilot_user_id, status) values (${recorded}::uuid, 0, ${pilot.id}::uuid, 'accepted')`);
    expect(await check()).toEqual([["2026-05-04", 2, 2500, 2900], ["2026-05-11", 1, 6000, 6000]]);
    await db.execute(sql`update lane_consents set status = 'hidden' where run_id = ${recorded}::uuid`);
    expect(await check()).toEqual([["2026-05-04", 2, 2500, 2900]]);
    await db.execute(sql`update lane_consents set status = 'accepted' where run_id = ${recorded}::uuid`);
    await db.execute(sql`delete from lane_consents where run_id = ${recorded}::uuid`);
    expect(await check()).toEqual([["2026-05-04", 2, 2500, 2900]]);
    // a run moved to another week leaves the old week and joins the new one
    await db.execute(sql`update runs set created_at = '2026-05-20T10:00:00Z' where id = ${second}::uuid`);
    expect(await check()).toEqual([["2026-05-04", 1, 3000, 3000], ["2026-05-18", 1, 2000, 2000]]);
    // a lane deleted, then a run deleted (its lanes with it)
    await db.execute(sql`delete from run_lanes where run_id = ${second}::uuid`);
    expect(await check()).toEqual([["2026-05-04", 1, 3000, 3000]]);
    await db.execute(sql`delete from runs where id = ${first}::uuid`);
    expect(await check()).toEqual([]);
  });

  /** The pilot's rows and marks as they are, without settling them. */
  const unsettled = async (pilotId: string) => {
    const res = await db.execute<{ rows: [string, number, number, number][]; marks: string[] }>(sql`select
      (select coalesce(json_agg(json_build_array(week, turnarounds, median_ms, p90_ms) order by week), '[]') from season_week_turnarounds where pilot_user_id = ${pilotId}::uuid) as rows,
      (select coalesce(json_agg(week order by week), '[]') from season_week_stale where pilot_user_id = ${pilotId}::uuid) as marks`);
    return res.rows[0]!;
  };

  it("a write only marks its week stale; the Season's read works it out again and shows the new numbers", async () => {
    const pilot = await freshUser("week-turnarounds-stale");
    const run = await seasonRun({ pilotId: pilot.id, at: "2026-05-05T10:00:00Z", flights: [[5, 37], [40, 95], [99, 150]] });
    // the derivation's write marked the week (one mark per writing transaction) and worked nothing out
    const before = await unsettled(pilot.id);
    expect(before.rows).toEqual([]);
    expect(before.marks.length).toBeGreaterThan(0);
    expect(new Set(before.marks)).toEqual(new Set(["2026-05-04"]));
    const [kept, fromLanes] = await bothSummaries(pilot.id);
    expect(kept).toBe(fromLanes);
    expect(JSON.parse(kept).turnaroundByWeek).toEqual([{ week: "2026-05-04", count: 2, medianTenths: 35, p90Tenths: 39 }]);
    expect(await unsettled(pilot.id)).toEqual({ rows: [["2026-05-04", 2, 3500, 3900]], marks: [] });
    // a later change (the second flight no longer lands: the 4.0 s turnaround is gone) is shown by the next read
    await db.execute(sql`update run_lanes set derived = jsonb_set(derived, '{flights,1,landMs}', 'null') where run_id = ${run}::uuid`);
    expect((await unsettled(pilot.id)).rows).toEqual([["2026-05-04", 2, 3500, 3900]]);
    const [keptAgain, fromLanesAgain] = await bothSummaries(pilot.id);
    expect(keptAgain).toBe(fromLanesAgain);
    expect(JSON.parse(keptAgain).turnaroundByWeek).toEqual([{ week: "2026-05-04", count: 1, medianTenths: 30, p90Tenths: 30 }]);
  });

  it("keeps the mark of a write that commits while a reader settles the week, and reads a marked week from its lanes", async () => {
    const pilot = await freshUser("week-turnarounds-race");
    const first = await seasonRun({ pilotId: pilot.id, at: "2026-05-05T10:00:00Z", flights: [[5, 37], [40, 95], [99, 150]] });
    const second = await seasonRun({ pilotId: pilot.id, at: "2026-05-07T10:00:00Z", flights: [[5, 20], [22, 60]] });
    await settleSeasonWeeks(db, [pilot.id]);
    expect((await unsettled(pilot.id)).rows).toEqual([["2026-05-04", 3, 3000, 3800]]);
    const kept = async () => (await db.execute<{ week: string; turnarounds: number; median_ms: number; p90_ms: number }>(
      sql`select to_char(week, 'YYYY-MM-DD') as week, turnarounds, median_ms, p90_ms from (${weeklyTurnaroundsKept(pilot.id)}) k order by week`)).rows;
    const pusher = await getPool().connect();
    const locker = await getPool().connect();
    try {
      // 1. a committed mark is there (a write that changed nothing of the numbers), then a push's transaction changes the
      // week (the second run loses its result) and is still open while a reader settles: the reader cannot see the
      // change, and must not delete the only mark that stands for it
      await db.execute(sql`update run_lanes set result_tenths = result_tenths + 1 where run_id = ${first}::uuid`);
      expect((await unsettled(pilot.id)).marks).toEqual(["2026-05-04"]);
      await pusher.query("begin");
      await pusher.query("update run_lanes set result_tenths = null where run_id = $1", [second]);
      await settleSeasonWeeks(db, [pilot.id]);
      await pusher.query("commit");
      const afterCommit = await unsettled(pilot.id);
      expect(afterCommit.rows).toEqual([["2026-05-04", 3, 3000, 3800]]); // worked out without the change
      expect(afterCommit.marks).toEqual(["2026-05-04"]); // the push's own mark
      // read in one snapshot, the marked week comes from its lanes: the change is there before anyone settles it
      expect(await kept()).toEqual([{ week: "2026-05-04", turnarounds: 2, median_ms: 3500, p90_ms: 3900 }]);
      const [summary, fromLanes] = await bothSummaries(pilot.id);
      expect(summary).toBe(fromLanes);
      expect(await unsettled(pilot.id)).toEqual({ rows: [["2026-05-04", 2, 3500, 3900]], marks: [] });

      // 2. a reader that has deleted the marks waits for the week's lock (held here) while a push commits a change: the
      // week is read after the lock, so the push's change is in it (and the push's mark is left for the next reader)
      await db.execute(sql`update run_lanes set result_tenths = 500 where run_id = ${second}::uuid`); // back: {2.0, 3.0, 4.0}
      await locker.query("begin");
      await locker.query("select pg_advisory_xact_lock(hashtextextended('season_week_turnarounds/' || $1 || '/' || '2026-05-04', 0))", [pilot.id]);
      const settling = settleSeasonWeeks(db, [pilot.id]);
      await new Promise((resolve) => setTimeout(resolve, 300)); // the reader is at the lock
      expect((await unsettled(pilot.id)).rows).toEqual([["2026-05-04", 2, 3500, 3900]]);
      await pusher.query("update run_lanes set result_tenths = null where run_id = $1", [first]); // {2.0} alone
      await locker.query("commit");
      await settling;
      const settled = await unsettled(pilot.id);
      expect(settled.rows).toEqual([["2026-05-04", 1, 2000, 2000]]);
      expect(settled.marks).toEqual(["2026-05-04"]);
      const both = await weekTurnaroundsBeside([pilot.id]);
      expect(both.stored).toEqual(both.fromFlights);
    } finally {
      pusher.release();
      locker.release();
    }
  });
});
