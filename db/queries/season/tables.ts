import "server-only";
import { sql, type SQL } from "drizzle-orm";
import type { SeasonFlightRow, SeasonPage, SeasonRunRow } from "@/lib/season/types";
import type { FLIGHT_SORTS, RUN_SORTS, SeasonFilters } from "@/lib/validations/season";
import type { Database } from "../../index";
import { seasonScope, shareOf } from "./scope";

type Paging<S extends string> = { sort: S; dir: "asc" | "desc"; page: number; size: number } | "all";

const RUN_ORDER: Record<(typeof RUN_SORTS)[number], SQL> = {
  date: sql`sl.created_at`, field: sql`sl.field_name`, task: sql`sl.task_code`, result: sql`sl.result_tenths`,
  share: sql`${shareOf}`, flights: sql`sl.flight_count`,
};
const FLIGHT_ORDER: Record<(typeof FLIGHT_SORTS)[number], SQL> = {
  date: sql`f.created_at`, task: sql`f.task_code`, duration: sql`f.time_tenths`, credited: sql`f.credited_tenths`, turnaround: sql`f.turnaround_ms`,
};

/** ORDER BY the chosen column (nulls last), then a fixed tie-break so pages never overlap; LIMIT/OFFSET for a page. */
function pageClause(order: SQL | null, paging: Paging<string>, tie: SQL): SQL {
  if (paging === "all") return sql`order by ${tie}`;
  const dir = paging.dir === "asc" ? sql`asc` : sql`desc`;
  return sql`order by ${order} ${dir} nulls last, ${tie} limit ${paging.size} offset ${(paging.page - 1) * paging.size}`;
}

/** The pilot's counted runs (one row per lane they flew) within the filters: a sorted page, or every row for an export. */
export async function listSeasonRuns(
  db: Database,
  params: { pilotId: string; filters: SeasonFilters; paging: Paging<(typeof RUN_SORTS)[number]> },
): Promise<SeasonPage<SeasonRunRow>> {
  const { paging } = params;
  const order = paging === "all" ? null : RUN_ORDER[paging.sort];
  const res = await db.execute<{ page: { rows: SeasonRunRow[] | null; total: number } }>(sql`
    ${seasonScope(params.pilotId, params.filters)}
    select json_build_object('total', (select count(*)::int from season_lanes), 'rows', (select json_agg(x) from (
      select sl.run_id as "runId", sl.lane, sl.created_at as at, sl.field_name as field, sl.task_code as task,
        sl.result_tenths as "resultTenths", sl.max_tenths as "maxTenths", ${shareOf} as share,
        sl.flight_count::int as flights, sl.lost_tenths as "lostTenths",
        sl.penalty_points as "penaltyPoints", sl.contest
      from season_lanes sl ${pageClause(order, paging, sql`sl.created_at desc, sl.run_id, sl.lane`)}) x)) as page`);
  const page = res.rows[0]!.page;
  const rows = (page.rows ?? []).map((r) => ({ ...r, at: new Date(r.at).toISOString() }));
  return { rows, total: page.total, page: paging === "all" ? 1 : paging.page, size: paging === "all" ? rows.length : paging.size };
}

/** The flights of the pilot's counted runs within the filters, with the ground time before each: a sorted page, or all. */
export async function listSeasonFlights(
  db: Database,
  params: { pilotId: string; filters: SeasonFilters; paging: Paging<(typeof FLIGHT_SORTS)[number]> },
): Promise<SeasonPage<SeasonFlightRow>> {
  const { paging } = params;
  const order = paging === "all" ? null : FLIGHT_ORDER[paging.sort];
  const res = await db.execute<{ page: { rows: SeasonFlightRow[] | null; total: number } }>(sql`
    ${seasonScope(params.pilotId, params.filters)}
    select json_build_object('total', (select count(*)::int from season_flights), 'rows', (select json_agg(x) from (
      select f.run_id as "runId", f.lane, f.created_at as at, f.field_name as field, f.task_code as task, f.flight_index + 1 as flight,
        round(f.launch_ms / 100)::int as "launchTenths", round(f.land_ms / 100)::int as "landTenths",
        f.time_tenths as "durationTenths", f.credited_tenths as "creditedTenths", f.target_sec as "targetSec", f.status,
        round(f.turnaround_ms / 100)::int as "turnaroundTenths"
      from season_flights f ${pageClause(order, paging, sql`f.created_at desc, f.run_id, f.lane, f.flight_index`)}) x)) as page`);
  const page = res.rows[0]!.page;
  const rows = (page.rows ?? []).map((r) => ({ ...r, at: new Date(r.at).toISOString() }));
  return { rows, total: page.total, page: paging === "all" ? 1 : paging.page, size: paging === "all" ? rows.length : paging.size };
}
