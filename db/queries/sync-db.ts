import "server-only";
import { sql } from "drizzle-orm";
import type { Database } from "../index";

/** The client or an open transaction: sync writes run inside one transaction per push. */
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type Executor = Database | Tx;

/**
 * Key of the transaction-scoped advisory lock every write that takes `sync_seq` values holds
 * (pushes, derivations, the seed). Transactions holding it commit one after another, so
 * server_seq values become visible in increasing order and a pull cursor never skips a row
 * that commits later with a smaller number (SYNC.md §3). Any other code that writes rows with
 * nextval('sync_seq') must take it too.
 */
export const SYNC_LOCK_KEY = 7_340_061;

/** Take the sync lock until the end of the current transaction (re-entrant). */
export async function lockSync(tx: Tx): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(${SYNC_LOCK_KEY})`);
}

/** The last server sequence number handed out (0 before the first). */
export async function currentServerSeq(tx: Executor): Promise<number> {
  const r = await tx.execute<{ last_value: string; is_called: boolean }>(sql`select last_value, is_called from sync_seq`);
  const row = r.rows[0];
  return row && row.is_called ? Number(row.last_value) : 0;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Whether a string can be used where PostgreSQL expects a uuid (a bad one would abort the push). */
export function isUuid(s: string): boolean {
  return UUID.test(s);
}

/** Whether a wall time can become a PostgreSQL timestamp (JS Date range). */
export function isDateMs(ms: number): boolean {
  return Number.isFinite(ms) && Math.abs(ms) <= 8.64e15;
}
