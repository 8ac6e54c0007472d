import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { applyPush } from "@/db/queries/sync-push";
import { mulberry32 } from "@/lib/random";
import { deviceWorkload } from "../../bench/sync-workload";
import { db, freshUser, getPool } from "./support/db";
import { weekTurnaroundsBeside } from "./support/season-week-turnarounds";
import { LADDER, seasonRun } from "./support/season-records";

/**
 * run_lanes' Season columns and lane_flights are kept by one BEFORE trigger (migration
 * "run-lanes-season-columns-by-trigger") that rewrites only the flights a derivation changed, the
 * arrays element by element from the old ones. Here they are compared, after every step of a long
 * lane's changing derivations, with the definitions applied to the whole stored `derived`: the SQL
 * functions of migrations "season-lane-flight-arrays" and "season-lane-bins", the breakdown's values
 * as the generated columns read them (migration "season-lane-columns"), and lane_flights_rows_at over
 * every position (migration "lane-flights-changed-positions") — so a lane derived step by step holds
 * what a lane derived from scratch would.
 */
afterAll(async () => {
  await getPool().end();
});

type Check = { stored: unknown; defined: unknown; rows: unknown; definedRows: unknown };

const flightsOf = sql`(case when jsonb_typeof(l.derived -> 'flights') = 'array' then l.derived -> 'flights' else '[]'::jsonb end)`;

/** The lane's stored columns and lane_flights rows beside the same values computed from its whole `derived`. */
async function check(runId: string): Promise<Check> {
  const res = await db.execute<Check>(sql`
    select
      json_build_object('max', l.season_max_tenths, 'lost', l.season_lost_tenths, 'penalty', l.season_penalty_points,
        'parts', json_build_array(l.season_lost_ground_time, l.season_lost_over_cap, l.season_lost_short_of_target, l.season_lost_invalid,
          l.season_lost_not_counted, l.season_lost_round_zero),
        'count', l.season_flight_count, 'ground', l.season_ground_ms, 'landed', l.season_landed_tenths, 'target', l.season_target_sec,
        'turnaround', l.season_turnaround_ms, 'bins', l.season_duration_bins) as stored,
      json_build_object('max', (l.derived #>> '{breakdown,maxTenths}')::int, 'lost', (l.derived #>> '{breakdown,lostTenths}')::int,
        'penalty', coalesce((l.derived #>> '{breakdown,penaltyPoints}')::int, 0),
        'parts', json_build_array(coalesce((l.derived #>> '{breakdown,parts,groundTime}')::int, 0), coalesce((l.derived #>> '{breakdown,parts,overCap}')::int, 0),
          coalesce((l.derived #>> '{breakdown,parts,shortOfTarget}')::int, 0), coalesce((l.derived #>> '{breakdown,parts,invalid}')::int, 0),
          coalesce((l.derived #>> '{breakdown,parts,notCounted}')::int, 0), coalesce((l.derived #>> '{breakdown,parts,roundZero}')::int, 0)),
        'count', jsonb_array_length(${flightsOf}), 'ground', season_flight_ground_ms(l.derived), 'landed', season_flight_landed_tenths(l.derived),
        'target', season_flight_target_sec(l.derived), 'turnaround', season_flight_turnaround_ms(l.derived), 'bins', season_flight_duration_bins(l.derived)) as defined,
      (select coalesce(json_agg(json_build_array(f.position, f.flight_index, f.launch_ms, f.land_ms, f.status, f.time_tenths, f.credited_tenths, f.target_sec, f.ground_ms)
        order by f.position), '[]') from lane_flights f where f.run_id = l.run_id and f.lane = l.lane) as rows,
      (select coalesce(json_agg(json_build_array(r.position, r.flight_index, r.launch_ms, r.land_ms, r.status, r.time_tenths, r.credited_tenths, r.target_sec, r.ground_ms)
        order by r.position), '[]') from lane_flights_rows_at(${flightsOf}, array(select generate_series(0, jsonb_array_length(${flightsOf}) - 1))) r) as "definedRows"
    from run_lanes l where l.run_id = ${runId}::uuid and l.lane = 0`);
  return res.rows[0]!;
}

type Flight = { index: number; launchMs: number; landMs: number | null; status: string; reason: null; timeTenths: number; creditedTenths: number; targetSec: number | null };

describe("run_lanes' Season columns and lane_flights kept flight by flight", () => {
  it("equal the definitions over the whole derivation after each of 60 random changes to a long lane", async () => {
    const pilot = await freshUser("lane-incremental");
    const runId = await seasonRun({ pilotId: pilot.id, at: "2026-06-03T10:00:00Z", task: LADDER, flights: [[5, 37], [40, 95]] });
    const random = mulberry32(20261205);
    const int = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
    // a landed flight of 1–400 s (bins 0–10), sometimes launched before the previous landing (a negative ground time)
    const flight = (at: number): Flight => {
      const tenths = int(10, 4000);
      const launchMs = at + int(-2_000, 30_000);
      return { index: 0, launchMs, landMs: launchMs + tenths * 100, status: "counted", reason: null, timeTenths: tenths, creditedTenths: Math.min(tenths, 600), targetSec: null };
    };
    const startMs = 0;
    let flights: Flight[] = [];
    const next = () => (flights.length === 0 ? startMs : (flights[flights.length - 1]!.landMs ?? flights[flights.length - 1]!.launchMs) + 1_000);
    for (let i = 0; i < 300; i++) flights.push(flight(next()));
    let derived: Record<string, unknown> | null = null;
    const steps: string[] = [];
    const store = async (what: string, value: Record<string, unknown> | null) => {
      steps.push(what);
      derived = value;
      await db.execute(sql`update run_lanes set derived = ${value === null ? null : JSON.stringify(value)}::jsonb where run_id = ${runId}::uuid and lane = 0`);
      const c = await check(runId);
      expect([c.stored, c.rows], steps.join(" → ")).toEqual([c.defined, c.definedRows]);
    };
    const withFlights = () => ({
      breakdown: { maxTenths: int(0, 9000), lostTenths: int(0, 900), penaltyPoints: int(0, 1) === 0 ? undefined : int(1, 100), parts: { groundTime: int(0, 50), invalid: int(0, 3) } },
      versions: [], flights: flights.map((f, index) => ({ ...f, index })),
    });
    await store("300 flights", withFlights());
    for (let s = 0; s < 60; s++) {
      const op = int(0, 9);
      if (op === 0) {
        const k = int(1, 40);
        for (let i = 0; i < k; i++) flights.push(flight(next()));
        // the last one still in the air
        if (int(0, 1) === 1) Object.assign(flights[flights.length - 1]!, { landMs: null, timeTenths: 0, creditedTenths: 0, status: "in-air" });
        await store(`append ${k}`, withFlights());
      } else if (op === 1) {
        const f = flights[flights.length - 1]!;
        Object.assign(f, { landMs: f.launchMs + 45_000, timeTenths: 450, creditedTenths: 450, status: "counted" });
        await store("the last lands", withFlights());
      } else if (op === 2 && flights.length > 2) {
        const i = int(0, flights.length - 2);
        const f = flights[i]!;
        const tenths = int(10, 4000);
        Object.assign(f, { landMs: int(0, 4) === 0 ? null : f.launchMs + tenths * 100, timeTenths: tenths });
        await store(`flight ${i} corrected`, withFlights());
      } else if (op === 3) {
        const i = int(0, flights.length - 1);
        flights[i]!.targetSec = flights[i]!.targetSec === null ? int(30, 240) : null;
        await store(`target of flight ${i}`, withFlights());
      } else if (op === 4) {
        const k = Math.min(int(1, 30), flights.length);
        flights = flights.slice(0, flights.length - k);
        await store(`cut ${k}`, withFlights());
      } else if (op === 5) {
        // most flights change (every launch later): the definitions' own path
        flights = flights.map((f) => ({ ...f, launchMs: f.launchMs + 500, landMs: f.landMs === null ? null : f.landMs + 500 }));
        await store("every flight moved", withFlights());
      } else if (op === 6) {
        for (const f of flights) f.targetSec = null;
        await store("no targets", withFlights());
      } else if (op === 7) {
        await store("the same derivation again", withFlights());
      } else if (op === 8) {
        const f = int(0, 2);
        await store(f === 0 ? "no derivation" : f === 1 ? "flights not an array" : "no flights", f === 0 ? null : { ...withFlights(), flights: f === 1 ? null : [] });
        await store("flights back", withFlights());
      } else {
        // one flight removed from the middle: every later position shifts (the later half changes)
        const i = int(Math.floor(flights.length / 2), flights.length - 1);
        flights.splice(i, 1);
        await store(`flight ${i} removed`, withFlights());
      }
    }
    expect(derived).not.toBeNull();
    // the lane ended long, with targets, turnarounds and bins in use (the check compared something)
    const end = await check(runId);
    const stored = end.stored as { count: number; turnaround: number[] | null; bins: number[] };
    expect(stored.count).toBeGreaterThan(150);
    expect([stored.turnaround!.length > 50, stored.bins.filter((n) => n > 0).length > 5]).toEqual([true, true]);
    expect(new Set(steps.map((s) => s.split(" ")[0])).size).toBeGreaterThan(8);
  });

  it("after each push of a long run from a phone, as if derived from scratch, and the pilot's weeks too", async () => {
    const pilot = await freshUser("lane-incremental-push");
    const pushes = deviceWorkload(pilot.id, 1, 1_401, 200);
    let runId = "";
    for (const p of pushes) {
      runId ||= p.runs[0]!.id;
      await applyPush(db, pilot.id, p);
      const c = await check(runId);
      expect([c.stored, c.rows]).toEqual([c.defined, c.definedRows]);
      const weeks = await weekTurnaroundsBeside([pilot.id]);
      expect(weeks.stored).toEqual(weeks.fromFlights);
    }
    expect(((await check(runId)).stored as { count: number }).count).toBe(700);
  });
});
