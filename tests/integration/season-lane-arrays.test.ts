import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, demoUser, freshUser, getPool } from "./support/db";
import { laneAggregatesBeside } from "./support/season-lane-aggregates";
import { LADDER, seasonRun } from "./support/season-records";

/**
 * The Season's summary reads each lane's flights from arrays PostgreSQL generates on run_lanes
 * (season_ground_ms, season_landed_tenths, season_target_sec; migration "season-lane-flight-arrays")
 * instead of the lane's lane_flights rows. Here the arrays are checked element by element against
 * lane_flights (kept by its own trigger, tests/integration/season-lane-flights.test.ts), on every
 * seeded lane and across later derivations of a lane, so the summary's numbers cannot differ. The same
 * goes for the per-lane aggregates (season_turnaround_ms, season_duration_bins; migration "season-lane-bins")
 * against the values SQL computes from the lane's lane_flights rows.
 */
afterAll(async () => {
  await getPool().end();
});

type Pair = { lane: string; arrays: unknown; rows: unknown; aggregates: unknown; aggregatesFromRows: unknown };
const aggregates = laneAggregatesBeside(sql`l`);

/** Each lane's three arrays beside the same values built from its lane_flights rows in position order. */
async function pairs(where: ReturnType<typeof sql>): Promise<Pair[]> {
  const res = await db.execute<Pair>(sql`
    select l.run_id || '/' || l.lane as lane,
      json_build_object('ground', l.season_ground_ms, 'landed', l.season_landed_tenths, 'target', l.season_target_sec) as arrays,
      json_build_object(
        'ground', (select array_agg(f.ground_ms order by f.position) from lane_flights f where f.run_id = l.run_id and f.lane = l.lane),
        'landed', (select array_agg(case when f.land_ms is not null then f.time_tenths end order by f.position) from lane_flights f where f.run_id = l.run_id and f.lane = l.lane),
        'target', (select case when count(f.target_sec) > 0 then array_agg(f.target_sec order by f.position) end from lane_flights f where f.run_id = l.run_id and f.lane = l.lane)
      ) as rows,
      ${aggregates.stored} as aggregates, ${aggregates.fromFlights} as "aggregatesFromRows"
    from run_lanes l where ${where}`);
  return res.rows;
}

describe("run_lanes' flight arrays for the Season", () => {
  it("equal the lane's lane_flights rows on every lane of the seeded pilots", async () => {
    const ids = await Promise.all(["ada@example.com", "tobi@example.com", "lena@example.com"].map(async (e) => (await demoUser(e)).id));
    const rows = await pairs(sql`l.pilot_user_id in (${sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)})`);
    for (const row of rows) expect([row.arrays, row.aggregates], row.lane).toEqual([row.rows, row.aggregatesFromRows]);
    // real data with something in each array (an array stuck at null would fail)
    const filled = (k: "ground" | "landed" | "target") => rows.filter((r) => (r.arrays as Record<string, unknown[] | null>)[k]?.some((v) => v !== null)).length;
    expect(rows.length).toBeGreaterThan(100);
    expect([filled("ground") > 50, filled("landed") > 50, filled("target") > 0]).toEqual([true, true, true]);
    const stored = rows.map((r) => r.aggregates as { turnaround: number[] | null; bins: number[] });
    expect([stored.filter((a) => a.turnaround?.length).length > 50, stored.filter((a) => a.bins.some((n) => n > 0)).length > 50]).toEqual([true, true]);
  });

  it("follow each new derivation: a flight that no longer lands, a target removed, flights cut, no derivation", async () => {
    const pilot = await freshUser("lane-arrays");
    const runId = await seasonRun({ pilotId: pilot.id, at: "2026-05-08T10:00:00Z", task: LADDER, flights: [[5, 37], [40, 95]] });
    const lane = sql`l.run_id = ${runId}::uuid and l.lane = 0`;
    const arrays = async () => (await pairs(lane))[0]!;
    // hand-computed: 5 → 37 s is 32.0 s (target 30), relaunch at 40 s after landing at 37 s is 3.0 s on the ground, 40 → 95 s is 55.0 s (target 60)
    expect((await arrays()).arrays).toEqual({ ground: [null, 3000], landed: [320, 550], target: [30, 60] });
    // 32.0 s falls in the 30–60 s bin (the second), 55.0 s too; the one turnaround is the 3.0 s
    expect((await arrays()).aggregates).toEqual({ turnaround: [3000], bins: [0, 2, 0, 0, 0, 0, 0, 0, 0, 0, 0] });
    const setFlights = (expr: ReturnType<typeof sql>) =>
      db.execute(sql`update run_lanes set derived = jsonb_set(derived, '{flights}', ${expr}) where run_id = ${runId}::uuid and lane = 0`);
    await setFlights(sql`jsonb_set(derived -> 'flights', '{1,landMs}', 'null')`);
    expect((await arrays()).arrays).toEqual({ ground: [null, 3000], landed: [320, null], target: [30, 60] });
    expect((await arrays()).aggregates).toEqual({ turnaround: [3000], bins: [0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0] });
    await setFlights(sql`jsonb_set(jsonb_set(derived -> 'flights', '{0,targetSec}', 'null'), '{1,targetSec}', 'null')`);
    expect((await arrays()).arrays).toEqual({ ground: [null, 3000], landed: [320, null], target: null });
    await setFlights(sql`jsonb_build_array(derived -> 'flights' -> 0)`);
    const one = await arrays();
    expect(one.arrays).toEqual({ ground: [null], landed: [320], target: null });
    expect(one.arrays).toEqual(one.rows);
    expect([one.aggregates, one.aggregatesFromRows]).toEqual([{ turnaround: null, bins: [0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0] }, one.aggregates]);
    await db.execute(sql`update run_lanes set derived = null where run_id = ${runId}::uuid`);
    const none = await arrays();
    expect(none.arrays).toEqual({ ground: null, landed: null, target: null });
    expect(none.arrays).toEqual(none.rows);
    expect([none.aggregates, none.aggregatesFromRows]).toEqual([{ turnaround: null, bins: [0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0] }, none.aggregates]);
  });
});
