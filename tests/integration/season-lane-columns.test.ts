import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { flightsOnSignal } from "@/db/queries/season/turnaround";
import { flightsStartOnSignal, getCatalogueTask, type TaskDefinition } from "@/lib/tasks";
import { db, demoUser, freshUser, getPool } from "./support/db";
import { seasonRun } from "./support/season-records";

afterAll(async () => {
  await getPool().end();
});

type Breakdown = { maxTenths?: number; lostTenths?: number; penaltyPoints?: number; parts?: Record<string, number> };
type LaneRow = {
  derived: { breakdown?: Breakdown; flights?: unknown[] } | null; task: TaskDefinition; lane_flights: number; on_signal: boolean;
  season_max_tenths: number | null; season_lost_tenths: number | null; season_penalty_points: number; season_flight_count: number;
  season_lost_ground_time: number; season_lost_over_cap: number; season_lost_short_of_target: number;
  season_lost_invalid: number; season_lost_not_counted: number; season_lost_round_zero: number;
};

/** The lanes of these pilots with the columns PostgreSQL keeps from `derived`, and the count of their lane_flights rows. */
async function lanesOf(pilotIds: string[]): Promise<LaneRow[]> {
  const res = await db.execute<LaneRow>(sql`
    select l.derived, r.task, l.season_max_tenths, l.season_lost_tenths, l.season_penalty_points, l.season_flight_count,
      l.season_lost_ground_time, l.season_lost_over_cap, l.season_lost_short_of_target, l.season_lost_invalid,
      l.season_lost_not_counted, l.season_lost_round_zero, ${flightsOnSignal(sql`r`)} as on_signal,
      (select count(*)::int from lane_flights f where f.run_id = l.run_id and f.lane = l.lane) as lane_flights
    from run_lanes l join runs r on r.id = l.run_id
    where l.pilot_user_id in (${sql.join(pilotIds.map((id) => sql`${id}::uuid`), sql`, `)})`);
  return res.rows;
}

/** What the derived JSON holds, read here in TypeScript (the Season read it with SQL JSON operators before). */
function fromJson(row: LaneRow) {
  const b = row.derived?.breakdown;
  const part = (k: string) => b?.parts?.[k] ?? 0;
  return {
    max: b?.maxTenths ?? null, lost: b?.lostTenths ?? null, penalty: b?.penaltyPoints ?? 0,
    parts: [part("groundTime"), part("overCap"), part("shortOfTarget"), part("invalid"), part("notCounted"), part("roundZero")],
    flights: Array.isArray(row.derived?.flights) ? row.derived.flights.length : 0, onSignal: flightsStartOnSignal(row.task),
  };
}
const fromColumns = (row: LaneRow) => ({
  max: row.season_max_tenths, lost: row.season_lost_tenths, penalty: row.season_penalty_points,
  parts: [row.season_lost_ground_time, row.season_lost_over_cap, row.season_lost_short_of_target, row.season_lost_invalid, row.season_lost_not_counted, row.season_lost_round_zero],
  flights: row.season_flight_count, onSignal: row.on_signal,
});

describe("run_lanes' season columns, kept by PostgreSQL from the stored derivation", () => {
  it("equal what the derived JSON holds on every lane of the seeded pilots and of a task C run, and count the lane's lane_flights rows", async () => {
    const pilot = await freshUser("lane-columns");
    await seasonRun({ pilotId: pilot.id, at: "2026-05-06T10:00:00Z", task: getCatalogueTask("C", 3), signals: [0, 300, 600], flights: [[1, 190], [301, 490], [601, 800]] });
    await seasonRun({ pilotId: pilot.id, at: "2026-05-07T10:00:00Z", flights: [[5, 60], [62.4, 130], [135, 200], [210, 250]] });
    const ids = [pilot.id, ...(await Promise.all(["ada@example.com", "tobi@example.com", "lena@example.com"].map(async (e) => (await demoUser(e)).id)))];
    const rows = await lanesOf(ids);
    for (const row of rows) {
      expect(fromColumns(row)).toEqual(fromJson(row));
      expect(row.season_flight_count).toBe(row.lane_flights);
    }
    // real data, with something in each column (so a column stuck at 0 or null would fail)
    expect(rows.filter((r) => r.derived?.breakdown).length).toBeGreaterThan(100);
    expect(rows.some((r) => r.on_signal)).toBe(true);
    expect(rows.some((r) => r.season_lost_ground_time > 0)).toBe(true);
    expect(rows.some((r) => r.season_lost_short_of_target > 0)).toBe(true);
    expect(rows.some((r) => r.season_flight_count > 3)).toBe(true);
  });
});
