import "server-only";
import { sql, type SQL } from "drizzle-orm";
import type { SeasonFilters } from "@/lib/validations/season";

const DAY_MS = 24 * 3600 * 1000;

/** The filters as a SQL condition on `r` (runs) and `s` (field_sessions); dates are UTC calendar days, both ends included. */
/** The points-lost causes of the stored breakdown (lib/tasks/breakdown.ts), each a column of `season_lanes` (tenths). */
export const LOST_PARTS = ["groundTime", "overCap", "shortOfTarget", "invalid", "notCounted", "roundZero"] as const;
const contest = sql`exists (select 1 from group_slots g where g.run_id = r.id)`;

/** The lane's model events (undone ones left out) that name `modelId`. */
function namesModel(runId: SQL, lane: SQL, modelId: string): SQL {
  return sql`select 1 from events e where e.run_id = ${runId} and e.kind = 'model' and (e.body ->> 'lane')::int = ${lane}
    and e.body ->> 'modelId' = ${modelId}
    and not exists (select 1 from events v where v.run_id = e.run_id and v.kind = 'void' and v.body ->> 'targetId' = e.id::text)`;
}

function filterWhere(f: SeasonFilters): SQL {
  const parts: SQL[] = [sql`true`];
  if (f.from) parts.push(sql`r.created_at >= ${new Date(`${f.from}T00:00:00Z`).toISOString()}::timestamptz`);
  if (f.to) parts.push(sql`r.created_at < ${new Date(Date.parse(`${f.to}T00:00:00Z`) + DAY_MS).toISOString()}::timestamptz`);
  if (f.task) parts.push(sql`r.task_code = ${f.task}`);
  if (f.field) parts.push(sql`s.field_name = ${f.field}`);
  if (f.kind === "contest") parts.push(contest);
  if (f.kind === "practice") parts.push(sql`not ${contest}`);
  if (f.model) parts.push(sql`exists (${namesModel(sql`r.id`, sql`l.lane`, f.model)})`);
  return sql.join(parts, sql` and `);
}

/**
 * The pilot's season as SQL common table expressions, for the queries beside this file:
 * - `season_lanes`: each lane the pilot flew that counts in their record (lib/sync/consent.ts:
 *   a run they created, or one recorded for them that they accepted) and has a result (the
 *   window was started), within the filters; with the server's stored result (run_lanes, derived
 *   by lib/results runResult on every push — never recomputed here);
 * - `season_flights`: those lanes' derived flights, each with the ground time since the lane's
 *   previous landing (`ground_ms`: null for the first flight or when the previous one never landed),
 *   as stored at derive time in `lane_flights` (db/schema/lane-flights.ts), not unpacked from JSON here;
 * - `season_heights`: those flights whose launch an altimeter log matched (launch_heights; when two
 *   logs of a lane matched the same flight, the newer log's), with the model filter on the model the
 *   launch was made with.
 * A run is a contest run when a contest's draw names it (group_slots.run_id); else practice.
 */
export function seasonScope(pilotId: string, f: SeasonFilters): SQL {
  return sql`
    with season_lanes as materialized (
      select r.id as run_id, l.lane, r.task_code, r.created_at, s.field_name,
        l.result_tenths, (l.season_breakdown ->> 'maxTenths')::int as max_tenths,
        (select count(*) from lane_flights lf where lf.run_id = l.run_id and lf.lane = l.lane)::int as flight_count, ${contest} as contest,
        ${sql.join(LOST_PARTS.map((k) => sql`coalesce((l.season_breakdown #>> ${`{parts,${k}}`})::int, 0) as ${sql.identifier(k)}`), sql`, `)},
        (l.season_breakdown ->> 'lostTenths')::int as lost_tenths, coalesce((l.season_breakdown ->> 'penaltyPoints')::int, 0) as penalty_points
      from run_lanes l
      join runs r on r.id = l.run_id
      join field_sessions s on s.id = r.session_id
      left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
      where l.pilot_user_id = ${pilotId}
        and (r.created_by = ${pilotId} or c.status = 'accepted')
        and l.result_tenths is not null
        and ${filterWhere(f)}
    ), season_flights as materialized (
      select sl.run_id, sl.lane, sl.task_code, sl.created_at, sl.field_name,
        f.flight_index, f.launch_ms, f.land_ms, f.status, f.time_tenths, f.credited_tenths, f.target_sec, f.ground_ms
      from season_lanes sl
      join lane_flights f on f.run_id = sl.run_id and f.lane = sl.lane
    ), season_heights as materialized (
      select f.created_at, f.time_tenths, f.land_ms, h.height_m
      from season_flights f
      join lateral (
        select h.height_m, h.model_id from launch_heights h join altimeter_logs g on g.id = h.log_id
        where h.run_id = f.run_id and h.lane = f.lane and h.flight_index = f.flight_index
        order by g.created_at desc, h.at_ms limit 1
      ) h on true
      ${f.model ? sql`where h.model_id = ${f.model}` : sql``}
    )`;
}

/** A lane's result as a share of its task's maximum (null when the task has no maximum). */
export const shareOf = sql`(case when sl.max_tenths > 0 then sl.result_tenths::float8 / sl.max_tenths end)`;

/** The Monday (UTC) of the week of `column`, as a date. */
export const weekOf = (column: SQL) => sql`(date_trunc('week', ${column} at time zone 'UTC'))::date`;
