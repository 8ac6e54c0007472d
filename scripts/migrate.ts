// Applies the committed Drizzle migrations to $DATABASE_URL (idempotent).
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { Pool } from "pg";

const url = process.env.DATABASE_URL;
if (!url) throw new Error("DATABASE_URL is not set");
const pool = new Pool({ connectionString: url, max: 1 });
try {
  await migrate(drizzle(pool), { migrationsFolder: new URL("../db/migrations", import.meta.url).pathname });
  console.log(`[windowcall] migrations applied to ${new URL(url).pathname.slice(1)}`);
} finally {
  await pool.end();
}
