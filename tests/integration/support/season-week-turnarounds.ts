import { sql } from "drizzle-orm";
import { weekOf } from "@/db/queries/season/scope";
import { flightsOnSignal, isTurnaround } from "@/db/queries/season/turnaround";
import { settleSeasonWeeks } from "@/db/queries/season/weeks";
import { db } from "./db";

type Week = [pilot: string, week: string, turnarounds: number, medianMs: number, p90Ms: number];

/**
 * The pilots' rows of season_week_turnarounds (marked stale by triggers, settled here first as every reader does:
 * db/queries/season/weeks.ts) beside
 * the same values computed here from lane_flights: the season's lanes as db/queries/season/scope.ts picks them (the
 * pilot's, created by them or accepted, with a result), their flights' ground times where isTurnaround holds
 * (db/queries/season/turnaround.ts, the task's part included), per week (weekOf), with percentile_cont.
 */
export async function weekTurnaroundsBeside(pilotIds: string[]): Promise<{ stored: Week[]; fromFlights: Week[] }> {
  await settleSeasonWeeks(db, pilotIds);
  const ids = sql`array[${sql.join(pilotIds.map((id) => sql`${id}::uuid`), sql`, `)}]::uuid[]`;
  const res = await db.execute<{ stored: Week[]; fromFlights: Week[] }>(sql`
    select
      (select coalesce(json_agg(json_build_array(s.pilot_user_id, s.week, s.turnarounds, s.median_ms, s.p90_ms) order by s.pilot_user_id, s.week), '[]')
        from season_week_turnarounds s where s.pilot_user_id = any(${ids})) as stored,
      (select coalesce(json_agg(json_build_array(x.pilot, x.week, x.n, x.p[1], x.p[2]) order by x.pilot, x.week), '[]') from (
        select l.pilot_user_id as pilot, ${weekOf(sql`r.created_at`)} as week, count(*)::int as n,
          percentile_cont(array[0.5, 0.9]) within group (order by f.ground_ms) as p
        from run_lanes l
        join runs r on r.id = l.run_id
        left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
        join lane_flights f on f.run_id = l.run_id and f.lane = l.lane
        where l.pilot_user_id = any(${ids}) and l.result_tenths is not null and (r.created_by = l.pilot_user_id or c.status = 'accepted')
          and ${isTurnaround(sql`f.ground_ms`, flightsOnSignal(sql`r`))}
        group by 1, 2) x) as "fromFlights"`);
  return res.rows[0]!;
}
