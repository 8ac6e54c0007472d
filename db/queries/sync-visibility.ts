import "server-only";
import { sql } from "drizzle-orm";

/**
 * What the user may see, lane by lane (SQL common table expressions, for the queries below):
 * - `full_runs`: runs in sessions they own, runs they created (timing someone) and runs where
 *   they fly a lane — whole, every lane;
 * - `coach_lanes`: in other runs, only the lanes of pilots who granted them coach access (not
 *   revoked), and of those only lanes that count in that pilot's record (their own, or
 *   accepted: lib/sync/consent.ts). The other pilots of a shared run stay out of sight.
 */
export function visibility(userId: string) {
  return sql`
    with coached as (
      select pilot_id from coach_grants where coach_id = ${userId} and revoked_at is null
    ), full_runs as (
      -- three index lookups (a run always has its session); one filter over a join of all runs
      -- and sessions read every run on the server
      select r.id from field_sessions s join runs r on r.session_id = s.id where s.owner_id = ${userId}
      union select r.id from runs r where r.created_by = ${userId}
      union select l.run_id from run_lanes l where l.pilot_user_id = ${userId}
    ), coach_lanes as (
      select l.run_id, l.lane from run_lanes l
      join runs r on r.id = l.run_id
      left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
      where l.pilot_user_id in (select pilot_id from coached)
        and (l.pilot_user_id = r.created_by or c.status = 'accepted')
        and l.run_id not in (select id from full_runs)
    ), visible_runs as (
      select id from full_runs union select run_id from coach_lanes
    )`;
}
