import { sql } from "drizzle-orm";
import { db } from "./db";

/**
 * Exact row counts of every table and the sync sequence, as one string: any insert or delete changes it. One
 * table is left out on purpose: `rate_limits` holds the attempt counters, and counting a refused password guess
 * (a 403 from DELETE /api/account, say) is that request's intended effect (lib/auth/attempts.ts).
 */
export async function rowCounter(): Promise<() => Promise<string>> {
  const tables = await db.execute<{ t: string }>(
    sql`select tablename as t from pg_tables where schemaname = 'public' and tablename not like '%drizzle%' and tablename <> 'rate_limits' order by 1`,
  );
  const parts = tables.rows.map((r) => sql`select ${r.t} as t, count(*)::int as n from ${sql.identifier(r.t)}`);
  const query = sql`${sql.join(parts, sql` union all `)} union all select 'sync_seq', last_value::int from sync_seq`;
  // sorted here: a union all may return its parts in any order (a parallel append does)
  return async () => JSON.stringify((await db.execute<{ t: string; n: number }>(query)).rows.sort((a, b) => (a.t < b.t ? -1 : a.t > b.t ? 1 : 0)));
}
