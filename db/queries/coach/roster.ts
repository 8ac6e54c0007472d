import "server-only";
import { sql } from "drizzle-orm";
import type { Database } from "../../index";
import { flightsOnSignal, isTurnaround } from "../season/turnaround";
import type { RosterPilot } from "@/lib/coach/types";

/**
 * The coach's roster: each pilot granting them an unrevoked grant, with the figures above, all
 * aggregated here in one query over the lanes that count in each pilot's record (as the Season's
 * scope, db/queries/season/scope.ts: a run the pilot created, or one recorded for them they accepted).
 * Turnaround is the ground time the Season reads too (lane_flights.ground_ms, stored at derive time),
 * so the roster and the pilot's Season never disagree on it.
 */
export async function getRoster(db: Database, coachId: string, now = new Date()): Promise<RosterPilot[]> {
  const at = now.toISOString();
  const res = await db.execute<{
    pilot_id: string; name: string; last_session_at: string | null; runs_this_month: number;
    result_recent: number | null; result_before: number | null; ground_recent: number | null; ground_before: number | null;
  }>(sql`
    with pilots as (
      select g.pilot_id, u.name from coach_grants g join users u on u.id = g.pilot_id
      where g.coach_id = ${coachId} and g.revoked_at is null and u.deleted_at is null
      group by g.pilot_id, u.name
    ), lanes as (
      select l.pilot_user_id as pilot_id, r.id as run_id, l.lane, r.created_at, s.started_at, l.result_tenths,
        l.season_max_tenths as max_tenths, ${flightsOnSignal(sql`r`)} as flights_on_signal,
        ${at}::timestamptz - r.created_at as age
      from run_lanes l
      join runs r on r.id = l.run_id
      join field_sessions s on s.id = r.session_id
      left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
      where l.pilot_user_id in (select pilot_id from pilots)
        and (r.created_by = l.pilot_user_id or c.status = 'accepted')
        and l.result_tenths is not null
    ), grounds as (
      select ln.pilot_id, ln.age, f.ground_ms / 1000.0 as ground_s
      from lanes ln join lane_flights f on f.run_id = ln.run_id and f.lane = ln.lane
      where ln.age < interval '60 days' and ${isTurnaround(sql`f.ground_ms`, sql`ln.flights_on_signal`)}
    )
    select p.pilot_id::text, p.name,
      (select max(started_at) from lanes where pilot_id = p.pilot_id) as last_session_at,
      (select count(distinct run_id)::int from lanes where pilot_id = p.pilot_id
        and created_at >= date_trunc('month', ${at}::timestamptz at time zone 'UTC') at time zone 'UTC') as runs_this_month,
      (select avg(result_tenths::float8 / max_tenths) from lanes where pilot_id = p.pilot_id and max_tenths > 0
        and age < interval '30 days') as result_recent,
      (select avg(result_tenths::float8 / max_tenths) from lanes where pilot_id = p.pilot_id and max_tenths > 0
        and age >= interval '30 days' and age < interval '60 days') as result_before,
      (select percentile_cont(0.5) within group (order by ground_s) from grounds where pilot_id = p.pilot_id
        and age < interval '30 days') as ground_recent,
      (select percentile_cont(0.5) within group (order by ground_s) from grounds where pilot_id = p.pilot_id
        and age >= interval '30 days') as ground_before
    from pilots p order by p.name`);
  const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));
  return res.rows.map((r) => ({
    pilotId: r.pilot_id, name: r.name,
    lastSessionAt: r.last_session_at ? new Date(r.last_session_at).toISOString() : null,
    runsThisMonth: Number(r.runs_this_month),
    result: { recent: num(r.result_recent), before: num(r.result_before) },
    turnaround: { recent: num(r.ground_recent), before: num(r.ground_before) },
  }));
}
