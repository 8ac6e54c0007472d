import "server-only";
import { sql } from "drizzle-orm";
import type { Database } from "../index";

export type SessionSummary = {
  id: string;
  fieldName: string;
  startedAt: Date;
  conditions: unknown;
  runCount: number;
  taskCodes: string[];
};

/**
 * The user's counted sessions, newest first: sessions they own, and sessions where they fly a
 * lane that counts in their record (lib/sync/consent.ts: a run they created, or one someone
 * else recorded for them that they accepted; pending, disputed and hidden lanes do not count).
 * Runs and tasks are counted the same way: the runs they created and the runs of theirs that count.
 */
export async function listRecentSessions(db: Database, params: { userId: string; limit: number }): Promise<SessionSummary[]> {
  const { userId } = params;
  const res = await db.execute<{ id: string; field_name: string; started_at: Date | string; conditions: unknown; run_count: number; task_codes: string[] }>(sql`
    with counted_runs as (
      select r.id, r.session_id, r.task_code from runs r
      where r.created_by = ${userId}
         or exists (select 1 from run_lanes l left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
                    where l.run_id = r.id and l.pilot_user_id = ${userId} and c.status = 'accepted')
    )
    select s.id, s.field_name, s.started_at, s.conditions,
      (select count(*)::int from counted_runs cr where cr.session_id = s.id) as run_count,
      coalesce((select array_agg(distinct cr.task_code order by cr.task_code) from counted_runs cr where cr.session_id = s.id), '{}') as task_codes
    from field_sessions s
    where s.owner_id = ${userId} or s.id in (select session_id from counted_runs)
    order by s.started_at desc
    limit ${params.limit}`);
  return res.rows.map((r) => ({
    id: r.id, fieldName: r.field_name, startedAt: new Date(r.started_at), conditions: r.conditions, runCount: r.run_count, taskCodes: r.task_codes,
  }));
}
