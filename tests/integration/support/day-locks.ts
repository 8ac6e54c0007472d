import { sql } from "drizzle-orm";
import { db } from "./db";

/**
 * Resolves when `p` has settled or another backend waits for a lock in a statement naming `table` (a club day by
 * default; at most 10 s).
 */
export async function settledOrWaiting(p: Promise<unknown>, table = "club_days"): Promise<"settled" | "waiting"> {
  let settled = false;
  void p.then(() => (settled = true), () => (settled = true));
  for (let i = 0; i < 200; i++) {
    if (settled) return "settled";
    const waiting = await db.execute<{ n: number }>(sql`
      select count(*)::int as n from pg_stat_activity
      where datname = current_database() and wait_event_type = 'Lock' and pid <> pg_backend_pid() and query ilike ${`%${table}%`}`);
    if (waiting.rows[0]!.n > 0) return "waiting";
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error("neither settled nor waiting after 10 s");
}
