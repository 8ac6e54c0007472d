import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { listSeasonFlights } from "@/db/queries/season/tables";
import { db, demoUser, freshUser, getPool } from "./support/db";
import { seasonRun } from "./support/season-records";

/**
 * The Season reads each flight's values from `lane_flights`, kept by a trigger from the lane's
 * derived flights. Here they are checked against the values the Season computed before, straight
 * from the derived JSON (the same SQL expressions the queries used then), on the seeded demo
 * pilots' seasons, and the trigger against later derivations of a lane.
 */
afterAll(async () => {
  await getPool().end();
});

type Row = Record<string, unknown>;
const key = (r: Row) => `${r.runId}/${r.lane}/${r.flight}`;
const byKey = (rows: Row[]) => [...rows].sort((a, b) => (key(a) < key(b) ? -1 : key(a) > key(b) ? 1 : 0));

/** The flights list's values for these lanes as the Season computed them from the derived JSON (`run_lanes.derived -> 'flights'`). */
async function fromJson(lanes: { runId: string; lane: number }[]): Promise<Row[]> {
  if (lanes.length === 0) return [];
  const res = await db.execute<Row>(sql`
    select l.run_id::text as "runId", l.lane, f."index" + 1 as flight,
      round(f."launchMs" / 100)::int as "launchTenths", round(f."landMs" / 100)::int as "landTenths",
      f."timeTenths" as "durationTenths", f."creditedTenths" as "creditedTenths", f."targetSec" as "targetSec", f.status,
      case when g.ground_ms >= 0 then round(g.ground_ms / 100)::int end as "turnaroundTenths"
    from run_lanes l
    cross join lateral rows from (jsonb_to_recordset(coalesce(l.derived -> 'flights', '[]'::jsonb))
      as ("index" int, "launchMs" float8, "landMs" float8, status text, "timeTenths" int, "creditedTenths" int, "targetSec" int)) with ordinality
      as f("index", "launchMs", "landMs", status, "timeTenths", "creditedTenths", "targetSec", ord)
    cross join lateral (select case when f.ord > 1 then f."launchMs" - (l.derived -> 'flights' -> (f.ord::int - 2) ->> 'landMs')::float8 end as ground_ms) g
    where (l.run_id::text || '/' || l.lane) in (select jsonb_array_elements_text(${JSON.stringify(lanes.map((l) => `${l.runId}/${l.lane}`))}::jsonb))`);
  return res.rows;
}

describe("the Season's flight values from lane_flights", () => {
  it("equal the values computed from the derived JSON, on every seeded pilot's season", async () => {
    let checked = 0;
    for (const email of ["ada@example.com", "tobi@example.com", "lena@example.com"]) {
      const pilot = await demoUser(email);
      const page = await listSeasonFlights(db, { pilotId: pilot.id, filters: { kind: "all" }, paging: "all" });
      const lanes = [...new Map(page.rows.map((r) => [`${r.runId}/${r.lane}`, { runId: r.runId, lane: r.lane }])).values()];
      const now = byKey(page.rows.map(({ runId, lane, flight, launchTenths, landTenths, durationTenths, creditedTenths, targetSec, status, turnaroundTenths }) => (
        { runId, lane, flight, launchTenths, landTenths, durationTenths, creditedTenths, targetSec, status, turnaroundTenths })));
      expect(now).toEqual(byKey(await fromJson(lanes)));
      const summary = await getSeasonSummary(db, { pilotId: pilot.id, filters: { kind: "all" }, now: new Date() });
      expect(summary.totals.flights).toBe(page.rows.length);
      checked += page.rows.length;
    }
    expect(checked).toBeGreaterThan(100); // the seed flies whole seasons: this compares real data
  });

  it("follow each new derivation of a lane, writing only the flights that changed", async () => {
    const pilot = await freshUser("lane-flights");
    const runId = await seasonRun({ pilotId: pilot.id, at: "2026-05-05T10:00:00Z", flights: [[5, 60], [62.4, 130], [135, 180]] });
    const rows = async () =>
      (await db.execute<{ position: number; ground_ms: number | null; time_tenths: number; xmin: string }>(sql`
        select "position", ground_ms, time_tenths, xmin::text from lane_flights where run_id = ${runId}::uuid and lane = 0 order by "position"`)).rows;
    const first = await rows();
    expect(first.map((r) => [r.position, r.ground_ms, r.time_tenths])).toEqual([[0, null, 550], [1, 2400, 676], [2, 5000, 450]]);

    const setFlights = (expr: ReturnType<typeof sql>) =>
      db.execute(sql`update run_lanes set derived = jsonb_set(derived, '{flights}', ${expr}) where run_id = ${runId}::uuid and lane = 0`);
    await setFlights(sql`derived -> 'flights' || jsonb_build_array(jsonb_build_object(
      'index', 3, 'launchMs', 1767000190000, 'landMs', 1767000200000, 'status', 'ok', 'timeTenths', 100, 'creditedTenths', 100, 'targetSec', null))`);
    const appended = await rows();
    expect(appended).toHaveLength(4);
    expect(appended.slice(0, 3)).toEqual(first); // same xmin: the three unchanged flights were not rewritten
    await setFlights(sql`jsonb_build_array(derived -> 'flights' -> 0)`);
    expect((await rows()).map((r) => r.position)).toEqual([0]);
    await db.execute(sql`update run_lanes set derived = null where run_id = ${runId}::uuid`);
    expect(await rows()).toEqual([]);
  });

  it("leave the rows of unchanged flights alone (not even locked), and rewrite a changed flight with the next one's ground time", async () => {
    const pilot = await freshUser("lane-flights-untouched");
    const runId = await seasonRun({ pilotId: pilot.id, at: "2026-05-06T10:00:00Z", flights: [[5, 60], [62.4, 130], [135, 180]] });
    const rows = async () =>
      (await db.execute<{ position: number; ground_ms: number | null; land_ms: number | null; xmax: string }>(sql`
        select "position", ground_ms, land_ms, xmax::text from lane_flights where run_id = ${runId}::uuid and lane = 0 order by "position"`)).rows;
    const setFlights = (expr: ReturnType<typeof sql>) =>
      db.execute(sql`update run_lanes set derived = jsonb_set(derived, '{flights}', ${expr}) where run_id = ${runId}::uuid and lane = 0`);
    await setFlights(sql`derived -> 'flights' || jsonb_build_array(jsonb_build_object(
      'index', 3, 'launchMs', 1767000190000, 'landMs', 1767000200000, 'status', 'ok', 'timeTenths', 100, 'creditedTenths', 100, 'targetSec', null))`);
    // an upsert of every flight (ON CONFLICT DO UPDATE … WHERE nothing changed) still locks each row: xmax set
    expect((await rows()).slice(0, 3).map((r) => r.xmax)).toEqual(["0", "0", "0"]);
    const before = await rows();
    await setFlights(sql`jsonb_set(derived -> 'flights', '{1,landMs}', to_jsonb((derived -> 'flights' -> 1 ->> 'landMs')::float8 - 1000))`);
    const after = await rows();
    expect(after[1]!.land_ms).toBe(before[1]!.land_ms! - 1000);
    expect(after[2]!.ground_ms).toBe(before[2]!.ground_ms! + 1000); // the next flight's ground time follows
    expect([after[0]!.xmax, after[3]!.xmax]).toEqual(["0", "0"]);
  });
});
