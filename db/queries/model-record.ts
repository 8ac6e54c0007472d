import "server-only";
import { sql } from "drizzle-orm";
import type { ModelLane } from "@/lib/hangar/stats";
import { flightInstants } from "@/lib/results/flight-instants";
import type { Database } from "../index";
import { flightsOnSignal, isTurnaround } from "./season/turnaround";

type Row = { run_id: string; lane: number; task_code: string; derived: unknown; choices: { atMs: number; modelId: string }[] | null; heights: { i: number; h: number }[] | null; grounds: { i: number; ms: number }[] | null };

/**
 * The lanes a model flew in, as lib/hangar/stats.ts reads them: lanes whose pilot is the model's
 * owner (or a seller who handed its history over; for a lane without an account, the run's
 * recorder) and where a model event names it. Undone model events are left out.
 */
export async function listModelLanes(db: Database, p: { modelId: string; ownerIds: string[] }): Promise<ModelLane[]> {
  const owners = sql`array[${sql.join(p.ownerIds.map((id) => sql`${id}::uuid`), sql`, `)}]`;
  const res = await db.execute<Row>(sql`
    with named as (
      select distinct e.run_id, (e.body->>'lane')::int as lane from events e
      where e.kind = 'model' and e.body->>'modelId' = ${p.modelId}
    )
    select l.run_id, l.lane, r.task_code, l.derived,
      -- in time order, ties by id: modelAt takes the last of equal instants, as db/queries/flight-model.ts does
      (select json_agg(json_build_object('atMs', e.corrected_ms, 'modelId', e.body->>'modelId') order by e.corrected_ms, e.id) from events e
        where e.run_id = l.run_id and e.kind = 'model' and (e.body->>'lane')::int = l.lane
          and not exists (select 1 from events v where v.run_id = e.run_id and v.kind = 'void' and v.body->>'targetId' = e.id::text)) as choices,
      -- one height per flight, as the Season picks it (season_heights): the newest log's, its first launch
      (select json_agg(json_build_object('i', x.flight_index, 'h', x.height_m)) from (
        select distinct on (h.flight_index) h.flight_index, h.height_m from launch_heights h join altimeter_logs g on g.id = h.log_id
        where h.run_id = l.run_id and h.lane = l.lane and h.flight_index is not null
        order by h.flight_index, g.created_at desc, h.at_ms) x) as heights,
      (select json_agg(json_build_object('i', f.flight_index, 'ms', f.ground_ms)) from lane_flights f
        where f.run_id = l.run_id and f.lane = l.lane and ${isTurnaround(sql`f.ground_ms`, flightsOnSignal(sql`r`))}) as grounds
    from named n
    join run_lanes l on l.run_id = n.run_id and l.lane = n.lane
    join runs r on r.id = l.run_id
    where l.pilot_user_id = any(${owners}) or (l.pilot_user_id is null and r.created_by = any(${owners}))`);
  return res.rows.map((r) => ({
    taskCode: r.task_code,
    flights: flightInstants(r.derived),
    choices: (r.choices ?? []).map((c) => ({ atMs: Number(c.atMs), modelId: c.modelId })),
    heights: new Map((r.heights ?? []).map((x) => [x.i, x.h])),
    groundMs: new Map((r.grounds ?? []).map((x) => [x.i, Number(x.ms)])),
  }));
}

/** The model's latest matched launch heights, newest first. */
export async function listRecentLaunchHeights(db: Database, p: { modelId: string; limit: number }) {
  const res = await db.execute<{ at_ms: number; height_m: number }>(sql`
    select at_ms, height_m from launch_heights where model_id = ${p.modelId} and flight_index is not null order by at_ms desc limit ${p.limit}`);
  return res.rows.map((r) => ({ atMs: Number(r.at_ms), heightM: r.height_m }));
}
