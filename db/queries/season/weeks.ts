import "server-only";
import { sql, type SQL } from "drizzle-orm";
import type { Database } from "../../index";

/**
 * The pilots' weeks marked stale (season_week_stale, db/schema/season-weeks.ts) worked out again into
 * season_week_turnarounds, their marks deleted: one statement, its own short transaction when `db` is the pool
 * (season_week_turnarounds_settle, migration "season-weeks-marked-stale"). Every reader of season_week_turnarounds calls
 * this first, so the weeks it reads are usually all settled; a mark a write commits meanwhile stays, and the reader's own
 * statement works that week out from its lanes (weeklyTurnaroundsKept), so what it reads is exact either way.
 */
export async function settleSeasonWeeks(db: Database, pilotIds: string[]): Promise<void> {
  if (pilotIds.length === 0) return;
  await db.execute(sql`select season_week_turnarounds_settle(array[${sql.join(pilotIds.map((id) => sql`${id}::uuid`), sql`, `)}]::uuid[])`);
}

/**
 * A pilot's weekly turnarounds (week, count, median and 90th percentile in ms) in one snapshot: the kept row of each week
 * with no mark, and each marked week worked out from its lanes by season_week_turnarounds_of (the one definition the rows
 * are kept by), so a write that commits after settleSeasonWeeks is counted as if its week were settled.
 */
export function weeklyTurnaroundsKept(pilotId: string): SQL {
  return sql`
      select s.week, s.turnarounds, s.median_ms, s.p90_ms from season_week_turnarounds s
      where s.pilot_user_id = ${pilotId} and not exists (select 1 from season_week_stale m where m.pilot_user_id = ${pilotId} and m.week = s.week)
      union all
      select m.week, x.turnarounds, x.p[1], x.p[2]
      from (select distinct week from season_week_stale where pilot_user_id = ${pilotId}) m
      cross join lateral season_week_turnarounds_of(${pilotId}, m.week) x`;
}
