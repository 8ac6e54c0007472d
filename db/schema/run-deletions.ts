import { sql } from "drizzle-orm";
import { bigint, index, pgTable, timestamp, uuid } from "drizzle-orm/pg-core";
import { writtenByXact } from "./xid";

/**
 * A window that was set up but never started and then deleted by the account that set it up
 * (db/queries/run-discard.ts). The run, its lanes and events are gone; this row remains so that
 * every phone that pulled the run drops it at its next pull (a pull's `forget`). `seenBy` holds
 * who could see the run when it was deleted (session owner, recorder, pilots with an account,
 * their coaches): ids only, no foreign keys;
 * deleting one of those accounts takes its id out (db/queries/account-delete.ts).
 */
export const runDeletions = pgTable(
  "run_deletions",
  {
    runId: uuid("run_id").primaryKey(),
    deletedBy: uuid("deleted_by"),
    seenBy: uuid("seen_by").array().notNull(),
    deletedAt: timestamp("deleted_at", { withTimezone: true }).notNull().defaultNow(),
    serverSeq: bigint("server_seq", { mode: "number" }).notNull().default(sql`nextval('sync_seq')`),
    xid: writtenByXact(),
  },
  (t) => [index("run_deletions_xid_seq_idx").on(t.xid, t.serverSeq)],
);
