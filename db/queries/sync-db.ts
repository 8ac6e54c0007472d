import "server-only";
import { sql, type SQL } from "drizzle-orm";
import type { Database } from "../index";

/** The client or an open transaction: sync writes run inside one transaction per push. */
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type Executor = Database | Tx;

/**
 * What a write that devices must pull again sets on its row (field_sessions, runs, events): a
 * new server_seq and the writing transaction's id. Pulls order by (xid, server_seq) and serve
 * only transactions older than every one still running (db/queries/sync-pull.ts), so writers
 * need no common lock: a row that commits late has an xid above every cursor handed out while
 * it ran (SYNC.md §3).
 */
export const syncStamp = () => ({ serverSeq: sql<number>`nextval('sync_seq')`, xid: sql<string>`pg_current_xact_id()` });

/**
 * Lock these runs' rows until the end of the transaction (FOR NO KEY UPDATE, in id order so two
 * writers never wait on each other in a cycle): one writer at a time counts, derives and re-stamps
 * a run, and nothing else is locked. It is the row-lock level of the update that follows; a plain
 * FOR UPDATE would also wait on, and deadlock with, the key-share locks other pushes' event
 * inserts take on the run through the foreign key.
 */
export async function lockRuns(tx: Tx, runIds: Iterable<string>): Promise<void> {
  const statement = lockRunsSql(runIds);
  if (statement) await tx.execute(statement);
}

/** lockRuns' statement (null when there is no run to lock). */
export function lockRunsSql(runIds: Iterable<string>): SQL | null {
  const ids = [...new Set(runIds)].sort();
  if (ids.length === 0) return null;
  return sql`select id from runs where id in (${sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)}) order by id for no key update`;
}

/**
 * Serialise one account's run creation (the runs-per-day cap counts, then inserts): a lock on a
 * key made from the account id, until the end of the transaction. Other accounts never wait.
 */
export async function lockAccountRuns(tx: Tx, userId: string): Promise<void> {
  await tx.execute(lockAccountRunsSql(userId));
}

/** lockAccountRuns' statement, for a pipelined message (the statements after it in the message run once it is granted). */
export const lockAccountRunsSql = (userId: string): SQL => sql`select pg_advisory_xact_lock(hashtextextended(${`runs-per-day:${userId}`}, 0))`;

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
