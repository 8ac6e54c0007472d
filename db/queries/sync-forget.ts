import "server-only";
import { sql } from "drizzle-orm";
import type { Executor } from "./sync-db";
import { visibility } from "./sync-visibility";

/** Most run ids one reply names to forget (a season of a coached pilot is far fewer). */
export const FORGET_MAX = 10_000;

/**
 * Runs the user's phone may hold as a coach's copy but may no longer see (SYNC.md §3: a pull
 * carries what the device must forget). Ids only, and only of runs that are not visible now:
 * - a lane of a pilot whose grant to this coach was revoked, in a run recorded before the
 *   revocation (by the phone's creation time), on a lane that counted in that pilot's record or
 *   that they decided on;
 * - a lane the pilot (still granting) hid or disputed: it may have been accepted before.
 * A run another of the user's rights still shows (their own, one they fly in, another granting
 * pilot's accepted lane) is never named; lanes lost from such a run are (forgottenLanes).
 */
export async function forgottenRuns(db: Executor, userId: string): Promise<string[]> {
  const res = await db.execute<{ id: string }>(sql`${visibility(userId)}
    select distinct l.run_id::text as id from run_lanes l
      join runs r on r.id = l.run_id
      join coach_grants g on g.pilot_id = l.pilot_user_id and g.coach_id = ${userId}
      left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
    where l.run_id not in (select id from visible_runs)
      and ((g.revoked_at is null and c.status in ('hidden', 'disputed'))
        or (g.revoked_at is not null and r.created_at <= g.revoked_at and (l.pilot_user_id = r.created_by or c.status is not null)))
    limit ${FORGET_MAX}`);
  return res.rows.map((r) => r.id);
}

/**
 * Lanes lost from runs the user still sees as a coach (SYNC.md §3): in a run visible to them only
 * through some pilots' lanes (`coach_lanes`), every lane of a pilot who grants or once granted
 * them access that is not visible now — hidden or disputed by its pilot, or the grant revoked
 * while another pilot's lane keeps the run in sight. The run's row is re-sent with only the lanes
 * they may see; this tells the phone to drop the lost lanes' events too. By run, lanes ascending.
 */
export async function forgottenLanes(db: Executor, userId: string): Promise<{ runId: string; lanes: number[] }[]> {
  const res = await db.execute<{ run_id: string; lanes: number[] }>(sql`${visibility(userId)}
    select l.run_id::text as run_id, array_agg(l.lane::int order by l.lane) as lanes from run_lanes l
    where l.run_id in (select run_id from coach_lanes)
      and l.pilot_user_id in (select pilot_id from coach_grants where coach_id = ${userId})
      and (l.run_id, l.lane) not in (select run_id, lane from coach_lanes)
    group by l.run_id
    limit ${FORGET_MAX}`);
  return res.rows.map((r) => ({ runId: r.run_id, lanes: r.lanes.map(Number) }));
}
