import "server-only";
import { sql, type SQL } from "drizzle-orm";
import type { SeasonFilters } from "@/lib/validations/season";
import type { SeasonSummary } from "@/lib/season/types";
import type { Database } from "../../index";
import { DURATION_BIN_SEC as BIN_SEC, isUnfiltered, LAST_DURATION_BIN as LAST_BIN, LOST_PARTS, seasonScope, shareOf } from "./scope";
import { settleSeasonWeeks, weeklyTurnaroundsKept } from "./weeks";

/** A day as the summary prints it (weeks, months, bests). */
const day = (column: SQL) => sql`to_char(${column}, 'YYYY-MM-DD')`;
/** Launch-height bins for "height against flight time": 10 m each, the last one open (100 m and higher). */
const HEIGHT_BIN_M = 10;
const LAST_HEIGHT_BIN = 10;

/**
 * Every chart and headline of a pilot's season within the filters, in one statement over one
 * scan of their lanes (db/queries/season/scope.ts). Times are integer tenths of a second, shares
 * are fractions of the task's maximum, weeks start on Monday (UTC). `now` picks "this month".
 */
export async function getSeasonSummary(db: Database, params: SummaryParams): Promise<SeasonSummary> {
  return JSON.parse(await getSeasonSummaryJson(db, params)) as SeasonSummary;
}

type SummaryParams = { pilotId: string; filters: SeasonFilters; now: Date };

/**
 * The same summary as the JSON text PostgreSQL writes: the season route sends it as it comes, without
 * parsing 60 kB into objects and writing them out again (the bench's season; the client parses it once).
 */
export async function getSeasonSummaryJson(db: Database, params: SummaryParams): Promise<string> {
  const now = params.now.toISOString();
  // the start of last month, this month and next month (UTC), as month_starts works them out: the months' lanes and
  // flights are picked by these constants (one range test per lane, not six with interval arithmetic)
  const [lastStart, thisStart, nextStart] = [-1, 0, 1].map((k) => new Date(Date.UTC(params.now.getUTCFullYear(), params.now.getUTCMonth() + k, 1)).toISOString());
  const inMonth = (column: SQL, m: "this" | "last") => (m === "this" ? sql`${column} >= ${thisStart}::timestamptz` : sql`${column} < ${thisStart}::timestamptz`);
  // the weeks pushes marked stale since the last read, worked out again before the summary reads them (weeks.ts)
  if (isUnfiltered(params.filters)) await settleSeasonWeeks(db, [params.pilotId]);
  const inMonths = (column: SQL) => sql`${column} >= ${lastStart}::timestamptz and ${column} < ${nextStart}::timestamptz`;
  const res = await db.execute<{ summary: string }>(sql`
    ${seasonScope(params.pilotId, params.filters, { lean: true })},
    weekly_turnaround as (${isUnfiltered(params.filters)
      // the whole season: each week's count, median and 90th percentile as PostgreSQL keeps them (season_week_turnarounds,
      // worked out by the same percentile_cont, settled above; a week marked since then from its lanes: weeks.ts), instead
      // of a sort of every turnaround of the season
      ? sql`
      select week, turnarounds as count, round(median_ms / 100)::int as median, round(p90_ms / 100)::int as p90
      from (${weeklyTurnaroundsKept(params.pilotId)}) k`
      : sql`
      select week, cardinality(turnarounds) as count, round(p[1] / 100)::int as median, round(p[2] / 100)::int as p90
      from (select week, turnarounds, (select percentile_cont(array[0.5, 0.9]) within group (order by x) from unnest(turnarounds) x) as p
        -- each week's turnarounds gathered in one hashed pass (an array, its percentiles taken from 53 small arrays
        -- instead of sorting every flight by week); OFFSET 0: the percentiles once per week (pulled up, the
        -- sub-select ran once for each of p[1] and p[2])
        from (select week, array_agg(turnaround_ms) as turnarounds from season_turnarounds group by week) t offset 0) w`}
    ), month_starts as (
      select date_trunc('month', ${now}::timestamptz at time zone 'UTC') at time zone 'UTC' as this,
        (date_trunc('month', ${now}::timestamptz at time zone 'UTC') - interval '1 month') at time zone 'UTC' as last
    ), month_lanes as (
      -- this month and last month in one pass over the lanes, and one over the flights
      select ${sql.join((["this", "last"] as const).map((m) => {
        const within = inMonth(sql`sl.created_at`, m);
        return sql`count(*) filter (where ${within})::int as ${sql.identifier(`${m}_runs`)},
          coalesce(sum(sl.flight_count) filter (where ${within}), 0)::int as ${sql.identifier(`${m}_flights`)},
          avg(${shareOf}) filter (where ${within}) as ${sql.identifier(`${m}_share`)}`;
      }), sql`, `)}
      from season_lanes sl where ${inMonths(sql`sl.created_at`)}
    ), month_flights as (
      select ${sql.join((["this", "last"] as const).map((m) => sql`round(percentile_cont(0.5) within group (order by f.turnaround_ms)
          filter (where ${inMonth(sql`f.created_at`, m)}) / 100)::int as ${sql.identifier(`${m}_turnaround`)}`), sql`, `)}
      from season_flights f
      where f.turnaround_ms is not null and ${inMonths(sql`f.created_at`)}
    ), weekly_lanes as (
      select sl.week, count(*)::int as windows, sum(sl.flight_count)::int as launches, count(sl.lost_tenths)::int as with_lost,
        ${sql.join(LOST_PARTS.map((k) => sql`sum(sl.${sql.identifier(k)}) filter (where sl.lost_tenths is not null)::int as ${sql.identifier(k)}`), sql`, `)},
        sum(sl.penalty_points) filter (where sl.lost_tenths is not null)::int as "penaltyPoints"
      from season_lanes sl group by 1
    )
    select json_build_object(
      'models', coalesce((select json_agg(json_build_object('id', m.id, 'name', m.name) order by m.name, m.id) from models m where m.owner_id = ${params.pilotId}), '[]'),
      'fields', coalesce((select json_agg(distinct s.field_name order by s.field_name) from field_sessions s where s.owner_id = ${params.pilotId}), '[]'),
      'totals', (select json_build_object('runs', count(*)::int, 'flights', coalesce(sum(flight_count), 0)::int) from season_lanes),
      'months', (select json_build_object(${sql.join((["this", "last"] as const).map((m) => sql`${m}::text, json_build_object('start', ${day(sql.raw(`ms.${m} at time zone 'UTC'`))},
          'runs', l.${sql.identifier(`${m}_runs`)}, 'flights', l.${sql.identifier(`${m}_flights`)}, 'share', l.${sql.identifier(`${m}_share`)},
          'turnaroundTenths', f.${sql.identifier(`${m}_turnaround`)})`), sql`, `)}) from month_starts ms, month_lanes l, month_flights f),
      'bests', coalesce((select json_agg(b order by b.task) from (
          -- each task's best result found by hashing (one pass), then only the lanes that reached it sorted
          -- for the earliest: not a sort of every lane of the season
          select distinct on (sl.task_code) sl.task_code as task, sl.result_tenths as "resultTenths", sl.max_tenths as "maxTenths",
            sl.run_id as "runId", to_char(sl.created_at at time zone 'UTC', 'YYYY-MM-DD') as day
          from season_lanes sl join (select task_code, max(result_tenths) as best from season_lanes group by 1) m
            on m.task_code = sl.task_code and m.best = sl.result_tenths
          order by sl.task_code, sl.result_tenths desc, sl.created_at) b), '[]'),
      'shareByWeek', coalesce((select json_agg(x order by x.week, x.task) from (
          select ${day(sql`x.week`)} as week, x.task, x.share, x.runs from (
            select sl.week, sl.task_code as task, avg(${shareOf}) as share, count(*)::int as runs
            from season_lanes sl where sl.max_tenths > 0 group by 1, 2) x) x), '[]'),
      'turnaroundByWeek', coalesce((select json_agg(json_build_object('week', to_char(week, 'YYYY-MM-DD'), 'count', count, 'medianTenths', median, 'p90Tenths', p90) order by week) from weekly_turnaround), '[]'),
      'turnaroundTrend', (select round((regr_slope(median, (week - date '2000-01-03') / 7))::numeric, 2)::float8 from weekly_turnaround),
      'targets', coalesce((select json_agg(t order by t."targetSec") from (
          select target_sec as "targetSec", count(*)::int as flights,
            count(*) filter (where time_tenths > target_sec * 10)::int as over,
            count(*) filter (where time_tenths < target_sec * 10)::int as under,
            coalesce(round(avg(time_tenths - target_sec * 10) filter (where time_tenths > target_sec * 10)), 0)::int as "meanOverTenths",
            coalesce(round(avg(target_sec * 10 - time_tenths) filter (where time_tenths < target_sec * 10)), 0)::int as "meanUnderTenths"
          from season_target_flights where landed group by 1) t), '[]'),
      'durations', coalesce((select json_agg(json_build_object('fromSec', bin * ${BIN_SEC}, 'toSec', case when bin < ${LAST_BIN} then (bin + 1) * ${BIN_SEC} end, 'flights', flights) order by bin)
          from season_durations where flights > 0), '[]'),
      'launchesByWeek', coalesce((select json_agg(json_build_object('week', ${day(sql`w.week`)}, 'windows', w.windows, 'launches', w.launches) order by w.week)
          from weekly_lanes w), '[]'),
      'lostByWeek', coalesce((select json_agg(json_build_object('week', ${day(sql`w.week`)},
          ${sql.join(LOST_PARTS.map((k) => sql`${k}::text, w.${sql.identifier(k)}`), sql`, `)}, 'penaltyPoints', w."penaltyPoints") order by w.week)
          from weekly_lanes w where w.with_lost > 0), '[]'),
      'heights', (select json_build_object('launches', count(*)::int,
          'medianM', round((percentile_cont(0.5) within group (order by height_m))::numeric, 1)::float8,
          'secondsPerTenMetres', round((10 * regr_slope(time_tenths / 10.0, height_m) filter (where land_ms is not null))::numeric, 1)::float8)
        from season_heights),
      'heightByWeek', coalesce((select json_agg(x order by x.week) from (
          select ${day(sql`week`)} as week, count(*)::int as launches,
            round((percentile_cont(0.5) within group (order by height_m))::numeric, 1)::float8 as "medianM",
            round(max(height_m)::numeric, 1)::float8 as "bestM"
          from season_heights group by 1) x), '[]'),
      'heightVsTime', coalesce((select json_agg(json_build_object('fromM', bin * ${HEIGHT_BIN_M}, 'toM', case when bin < ${LAST_HEIGHT_BIN} then (bin + 1) * ${HEIGHT_BIN_M} end,
          'flights', n, 'medianTenths', median) order by bin) from (
          select least(floor(height_m / ${HEIGHT_BIN_M})::int, ${LAST_HEIGHT_BIN}) as bin, count(*)::int as n,
            round(percentile_cont(0.5) within group (order by time_tenths))::int as median
          from season_heights where land_ms is not null group by 1) b), '[]')
    )::text as summary`);
  return res.rows[0]!.summary;
}
