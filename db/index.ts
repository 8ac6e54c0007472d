import "server-only";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema>;

const globalForDb = globalThis as unknown as { windowcallPool?: Pool };

function makePool(): Pool {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set (run `npm start`, which writes it)");
  return new Pool({ connectionString: url, max: 10 });
}

/** The one pool of the process (cached on globalThis so dev reloads reuse it). */
export const pool: Pool = globalForDb.windowcallPool ?? makePool();
globalForDb.windowcallPool = pool;

/** The one Drizzle client. */
export const db: Database = drizzle(pool, { schema });
