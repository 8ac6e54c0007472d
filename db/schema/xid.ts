import { sql } from "drizzle-orm";
import { customType } from "drizzle-orm/pg-core";

/**
 * PostgreSQL `xid8`: a 64-bit transaction id. Read as text (it may pass 2^53); rows never write it
 * from JavaScript — the default stamps the writing transaction's id.
 */
const xid8 = customType<{ data: string; driverData: string }>({ dataType: () => "xid8" });

/**
 * The id of the transaction that last wrote the row (SYNC.md §3): a pull serves only rows whose
 * transaction is older than every transaction still running (`pg_snapshot_xmin`), so a row that
 * commits late can never fall behind a cursor already handed out. Every update that should reach
 * devices again sets it anew (`syncStamp` in db/queries/sync-db.ts).
 */
export const writtenByXact = () => xid8("xid").notNull().default(sql`pg_current_xact_id()`);
