import { sql } from "drizzle-orm";
import { db } from "./db";

/**
 * Resolves when `p` has settled or another backend waits for a lock in a statement naming `table` (a club day by
 * default; at most 10 s), or waits for a row of `table`: it then holds that row's tuple lock (PostgreSQL's heap_lock_tuple
 * takes it before waiting for the row's locker). The text shown for a pipelined message (db/queries/sync-pipeline.ts) is
 * cut at track_activity_query_size (1 kB by default), so the statement that waits may not be in it.
 */
export async function settledOrWaiting(p: Promise<unknown>, table = "club_days"): Promise<"settled" | "waiting"> {
  let settled = false;
  void p.then(() => (settled = true), () => (settled = true));
  for (let i = 0; i < 200; i++) {
    if (settled) return "settled";
    const waiting = await db.execute<{ n: number }>(sql`
      select count(*)::int as n from pg_stat_activity a
      where datname = current_database() and wait_event_type = 'Lock' and pid <> pg_backend_pid() and (query ilike ${`%${table}%`}
        or exists (select 1 from pg_locks l where l.pid = a.pid and l.locktype = 'tuple' and l.relation = ${table}::regclass))`);
    if (waiting.rows[0]!.n > 0) return "waiting";
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error("neither settled nor waiting after 10 s");
}
