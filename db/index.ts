import "server-only";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema>;

const cache = globalThis as unknown as { windowcallPool?: Pool; windowcallDb?: Database };

/** The one pool of the process, made on first use (the build imports modules without a database). */
export function getPool(): Pool {
  if (!cache.windowcallPool) {
    const url = process.env.DATABASE_URL;
    if (!url) throw new Error("DATABASE_URL is not set (run `npm start`, which sets it)");
    cache.windowcallPool = new Pool({ connectionString: url, max: 10 });
  }
  return cache.windowcallPool;
}

function getDb(): Database {
  return (cache.windowcallDb ??= drizzle(getPool(), { schema }));
}

/** The one Drizzle client (cached on globalThis so dev reloads reuse it). */
export const db: Database = new Proxy({} as Database, {
  get: (_target, prop) => Reflect.get(getDb(), prop),
});
