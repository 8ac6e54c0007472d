import "server-only";
import { sql } from "drizzle-orm";
import type { Database } from "../index";

export type ComingItem = { kind: "day" | "contest"; id: string; on: string; name: string; fieldName: string };

/**
 * The club's field days and contests from today on (the club's own rows only), soonest first.
 * `on` is the calendar date as stored (YYYY-MM-DD).
 */
export async function listComing(db: Database, params: { clubId: string; today: string; limit?: number }): Promise<ComingItem[]> {
  const res = await db.execute<{ kind: "day" | "contest"; id: string; on: string; name: string; field_name: string }>(sql`
    select * from (
      select 'day' as kind, (array_agg(d.id order by f.name))[1] as id, d.day::text as on,
        string_agg(f.name, ', ' order by f.name) as name, string_agg(f.name, ', ' order by f.name) as field_name
      from club_days d join club_fields f on f.id = d.field_id
      where d.club_id = ${params.clubId} and d.day >= ${params.today}::date
      group by d.day
      union all
      select 'contest', c.id, c.starts_on::text, c.name, c.field_name from contests c
      where c.club_id = ${params.clubId} and c.starts_on >= ${params.today}::date and c.status <> 'finished'
    ) x order by x.on, x.kind, x.name limit ${params.limit ?? 10}`);
  return res.rows.map((r) => ({ kind: r.kind, id: r.id, on: r.on, name: r.name, fieldName: r.field_name }));
}

export type MemberResult = { runId: string; pilotName: string; taskCode: string; resultTenths: number; fieldName: string; startedAt: Date };

/**
 * Recent results of the club's current members from sessions flown for this club (a session's
 * `club_id`): only lanes that count in the pilot's own record (a run they created, or one recorded
 * for them that they accepted; lib/sync/consent.ts), so nothing a pilot disputed or hid shows here.
 */
export async function listRecentMemberResults(db: Database, params: { clubId: string; limit?: number }): Promise<MemberResult[]> {
  const res = await db.execute<{ run_id: string; pilot_name: string; task_code: string; result_tenths: number; field_name: string; started_at: Date | string }>(sql`
    select r.id as run_id, u.name as pilot_name, r.task_code, l.result_tenths, s.field_name, r.created_at as started_at
    from field_sessions s
    join runs r on r.session_id = s.id
    join run_lanes l on l.run_id = r.id
    join memberships m on m.club_id = s.club_id and m.user_id = l.pilot_user_id
    join users u on u.id = l.pilot_user_id
    left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
    where s.club_id = ${params.clubId} and l.result_tenths is not null and u.disabled_at is null
      and (r.created_by = l.pilot_user_id or c.status = 'accepted')
    order by r.created_at desc, r.id, l.lane
    limit ${params.limit ?? 12}`);
  return res.rows.map((r) => ({
    runId: r.run_id, pilotName: r.pilot_name, taskCode: r.task_code, resultTenths: r.result_tenths, fieldName: r.field_name, startedAt: new Date(r.started_at),
  }));
}
