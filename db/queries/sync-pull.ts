import "server-only";
import { sql } from "drizzle-orm";
import type { PullReply } from "@/lib/validations/sync";
import { loadItems, type ChangeRow } from "./sync-pull-items";
import { visibility } from "./sync-visibility";
import type { Executor } from "./sync-db";

/** Items per pull page. */
export const PULL_PAGE_SIZE = 500;

/**
 * Everything the user may see that changed after `cursor`, in server_seq order, one page at a
 * time (SYNC.md §3): sessions they own, the runs and events `visibility` allows. A run in someone
 * else's session carries that session with it; every run carries its derived results, its
 * recorder and its lanes' consent; a coach's copy of a shared run carries only the lanes, results
 * and events of pilots who granted access (sync-pull-items.ts).
 *
 * Visibility is decided now, so rows that became visible through a new coach grant or a pilot's
 * acceptance may lie below the user's cursor: every reply carries `scope`, a fingerprint of the
 * active grants and of the coached pilots' accepted lanes, and a device that sees it change pulls
 * again from 0.
 */
export async function listChanges(db: Executor, params: { userId: string; cursor: number; limit?: number }): Promise<PullReply> {
  const limit = params.limit ?? PULL_PAGE_SIZE;
  const { userId, cursor } = params;
  const res = await db.execute<ChangeRow>(sql`${visibility(userId)}
    select * from (
      select 'session' as type, s.server_seq as seq, s.id::text as id from field_sessions s
        where s.server_seq > ${cursor} and s.owner_id = ${userId}
      union all
      select 'run', r.server_seq, r.id::text from runs r
        where r.server_seq > ${cursor} and r.id in (select id from visible_runs)
      union all
      select 'event', e.server_seq, e.id::text from events e
        where e.server_seq > ${cursor} and e.run_id in (select id from visible_runs)
    ) changes order by seq limit ${limit + 1}`);
  const rows = res.rows.slice(0, limit);
  const hasMore = res.rows.length > limit;
  const [items, scope] = await Promise.all([loadItems(db, userId, rows), visibilityScope(db, userId)]);
  const last = rows.at(-1);
  return { items, nextCursor: last ? Number(last.seq) : cursor, hasMore, scope };
}

/**
 * Fingerprint of what the user sees as a coach ("" with no grants): the granting pilots and the
 * lanes others recorded for them that they accepted.
 */
async function visibilityScope(db: Executor, userId: string): Promise<string> {
  const res = await db.execute<{ scope: string }>(sql`
    with coached as (
      select pilot_id from coach_grants where coach_id = ${userId} and revoked_at is null
    )
    select case when not exists (select 1 from coached) then '' else md5(
      coalesce((select string_agg(pilot_id::text, ',' order by pilot_id) from coached), '') || '|' ||
      coalesce((select string_agg(c.run_id::text || ':' || c.lane, ',' order by c.run_id, c.lane) from lane_consents c
                where c.pilot_user_id in (select pilot_id from coached) and c.status = 'accepted'), '')
    ) end as scope`);
  return res.rows[0]?.scope ?? "";
}
