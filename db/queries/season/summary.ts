import "server-only";
import { sql } from "drizzle-orm";
import type { SeasonFilters } from "@/lib/validations/season";
import type { SeasonSummary } from "@/lib/season/types";
import type { Database } from "../../index";
import { LOST_PARTS, seasonScope, shareOf } from "./scope";
import { isTurnaround } from "./turnaround";

/** The week (Monday, UTC) of a flight or lane, as season_flights / season_lanes carry it (scope.ts). */
const WEEK = sql`week`;
const SL_WEEK = sql`sl.week`;
/** A flight's ground time that counts as turnaround (turnaround.ts, the one definition). */
const TURNAROUND = isTurnaround(sql`ground_ms`);
/** Flight-duration histogram: 30-second bins, the last one open (300 s and longer). */
const BIN_SEC = 30;
const LAST_BIN = 10;
/** Launch-height bins for "height against flight time": 10 m each, the last one open (100 m and higher). */
const HEIGHT_BIN_M = 10;
const LAST_HEIGHT_BIN = 10;

/**
 * Every chart and headline of a pilot's season within the filters, in one statement over one
 * scan of their lanes (db/queries/season/scope.ts). Times are integer tenths of a second, shares
 * are fractions of the task's maximum, weeks start on Monday (UTC). `now` picks "this month".
 */
export async function getSeasonSummary(db: Database, params: { pilotId: string; filters: SeasonFilters; now: Date }): Promise<SeasonSummary> {
  const now = params.now.toISOString();
  const res = await db.execute<{ summary: SeasonSummary }>(sql`
    ${seasonScope(params.pilotId, params.filters)},
    weekly_turnaround as (
      select ${WEEK} as week, count(*)::int as count,
        round(percentile_cont(0.5) within group (order by ground_ms) / 100)::int as median,
        round(percentile_cont(0.9) within group (order by ground_ms) / 100)::int as p90
      from season_flights where ${TURNAROUND} group by 1
    ), months as (
      select m.which, m.start,
        (select count(*)::int from season_lanes sl where sl.created_at >= m.start and sl.created_at < m.start + interval '1 month') as runs,
        (select coalesce(sum(sl.flight_count), 0)::int from season_lanes sl where sl.created_at >= m.start and sl.created_at < m.start + interval '1 month') as flights,
        (select avg(${shareOf}) from season_lanes sl where sl.created_at >= m.start and sl.created_at < m.start + interval '1 month') as share,
        (select round(percentile_cont(0.5) within group (order by ground_ms) / 100)::int from season_flights
          where ${TURNAROUND} and created_at >= m.start and created_at < m.start + interval '1 month') as turnaround
      from (values ('this', date_trunc('month', ${now}::timestamptz at time zone 'UTC') at time zone 'UTC'),
                   ('last', (date_trunc('month', ${now}::timestamptz at time zone 'UTC') - interval '1 month') at time zone 'UTC')) as m(which, start)
    )
    select json_build_object(
      'models', coalesce((select json_agg(json_build_object('id', m.id, 'name', m.name) order by m.name, m.id) from models m where m.owner_id = ${params.pilotId}), '[]'),
      'fields', coalesce((select json_agg(distinct s.field_name order by s.field_name) from field_sessions s where s.owner_id = ${params.pilotId}), '[]'),
      'totals', (select json_build_object('runs', count(*)::int, 'flights', coalesce(sum(flight_count), 0)::int) from season_lanes),
      'months', (select json_object_agg(which, json_build_object('start', to_char(start at time zone 'UTC', 'YYYY-MM-DD'), 'runs', runs, 'flights', flights, 'share', share, 'turnaroundTenths', turnaround)) from months),
      'bests', coalesce((select json_agg(b order by b.task) from (
          select distinct on (sl.task_code) sl.task_code as task, sl.result_tenths as "resultTenths", sl.max_tenths as "maxTenths",
            sl.run_id as "runId", to_char(sl.created_at at time zone 'UTC', 'YYYY-MM-DD') as day
          from season_lanes sl order by sl.task_code, sl.result_tenths desc, sl.created_at) b), '[]'),
      'shareByWeek', coalesce((select json_agg(x order by x.week, x.task) from (
          select to_char(${SL_WEEK}, 'YYYY-MM-DD') as week, sl.task_code as task, avg(${shareOf}) as share, count(*)::int as runs
          from season_lanes sl where sl.max_tenths > 0 group by 1, 2) x), '[]'),
      'turnaroundByWeek', coalesce((select json_agg(json_build_object('week', to_char(week, 'YYYY-MM-DD'), 'count', count, 'medianTenths', median, 'p90Tenths', p90) order by week) from weekly_turnaround), '[]'),
      'turnaroundTrend', (select round((regr_slope(median, (week - date '2000-01-03') / 7))::numeric, 2)::float8 from weekly_turnaround),
      'targets', coalesce((select json_agg(t order by t."targetSec") from (
          select target_sec as "targetSec", count(*)::int as flights,
            count(*) filter (where time_tenths > target_sec * 10)::int as over,
            count(*) filter (where time_tenths < target_sec * 10)::int as under,
            coalesce(round(avg(time_tenths - target_sec * 10) filter (where time_tenths > target_sec * 10)), 0)::int as "meanOverTenths",
            coalesce(round(avg(target_sec * 10 - time_tenths) filter (where time_tenths < target_sec * 10)), 0)::int as "meanUnderTenths"
          from season_flights where target_sec is not null and land_ms is not null group by 1) t), '[]'),
      'durations', coalesce((select json_agg(json_build_object('fromSec', bin * ${BIN_SEC}, 'toSec', case when bin < ${LAST_BIN} then (bin + 1) * ${BIN_SEC} end, 'flights', n) order by bin) from (
          select least(time_tenths / ${BIN_SEC * 10}, ${LAST_BIN}) as bin, count(*)::int as n
          from season_flights where land_ms is not null group by 1) h), '[]'),
      'launchesByWeek', coalesce((select json_agg(x order by x.week) from (
          select to_char(${SL_WEEK}, 'YYYY-MM-DD') as week, count(*)::int as windows,
            sum(sl.flight_count)::int as launches
          from season_lanes sl group by 1) x), '[]'),
      'lostByWeek', coalesce((select json_agg(x order by x.week) from (
          select to_char(${SL_WEEK}, 'YYYY-MM-DD') as week,
            ${sql.join(LOST_PARTS.map((k) => sql`sum(sl.${sql.identifier(k)})::int as ${sql.identifier(k)}`), sql`, `)},
            sum(sl.penalty_points)::int as "penaltyPoints"
          from season_lanes sl where sl.lost_tenths is not null group by 1) x), '[]'),
      'heights', (select json_build_object('launches', count(*)::int,
          'medianM', round((percentile_cont(0.5) within group (order by height_m))::numeric, 1)::float8,
          'secondsPerTenMetres', round((10 * regr_slope(time_tenths / 10.0, height_m) filter (where land_ms is not null))::numeric, 1)::float8)
        from season_heights),
      'heightByWeek', coalesce((select json_agg(x order by x.week) from (
          select to_char(${WEEK}, 'YYYY-MM-DD') as week, count(*)::int as launches,
            round((percentile_cont(0.5) within group (order by height_m))::numeric, 1)::float8 as "medianM",
            round(max(height_m)::numeric, 1)::float8 as "bestM"
          from season_heights group by 1) x), '[]'),
      'heightVsTime', coalesce((select json_agg(json_build_object('fromM', bin * ${HEIGHT_BIN_M}, 'toM', case when bin < ${LAST_HEIGHT_BIN} then (bin + 1) * ${HEIGHT_BIN_M} end,
          'flights', n, 'medianTenths', median) order by bin) from (
          select least(floor(height_m / ${HEIGHT_BIN_M})::int, ${LAST_HEIGHT_BIN}) as bin, count(*)::int as n,
            round(percentile_cont(0.5) within group (order by time_tenths))::int as median
          from season_heights where land_ms is not null group by 1) b), '[]')
    ) as summary`);
  return res.rows[0]!.summary;
}
