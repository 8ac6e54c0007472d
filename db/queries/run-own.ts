import "server-only";
import { sql, type SQL } from "drizzle-orm";

/**
 * SQL condition: the run `run` (an alias of `runs`) is the user's own record — they set it up, or they
 * fly a lane of it that they did not dispute or hide (no consent row yet counts as theirs). Used where
 * a pilot acts on or reads about a run from its page: choosing its field day, a day's decision on it.
 */
export function runIsUsers(run: SQL, userId: string): SQL {
  return sql`(${run}.created_by = ${userId} or exists (
    select 1 from run_lanes own_l left join lane_consents own_c on own_c.run_id = own_l.run_id and own_c.lane = own_l.lane
    where own_l.run_id = ${run}.id and own_l.pilot_user_id = ${userId} and (own_c.status is null or own_c.status = 'accepted')))`;
}
