import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import pg from "pg";
import { afterAll, describe, expect, it } from "vitest";

/**
 * `npm run db:backup` and `npm run db:restore` (scripts/backup.sh, restore.sh) with Debian's
 * pg_dump and pg_restore: the test database, backed up and restored into a fresh database, has
 * every row of every table, and the same contents in the tables that matter most.
 */
const source = new URL(process.env.DATABASE_URL!);
const sourceDb = source.pathname.slice(1);
const restoredDb = `wc_restore_${process.pid}_${Date.now().toString(36)}`;
const dir = mkdtempSync(join(tmpdir(), "windowcall-backup-"));
const file = join(dir, "test.dump");

function urlOf(database: string): string {
  const url = new URL(source);
  url.pathname = `/${database}`;
  return url.toString();
}

async function withClient<T>(database: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: urlOf(database) });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** Row count of every table in the app's schemas (the migrations journal included). */
async function rowCounts(database: string): Promise<Record<string, number>> {
  return withClient(database, async (c) => {
    const { rows: tables } = await c.query<{ name: string }>(
      `select format('%I.%I', table_schema, table_name) as name from information_schema.tables
       where table_type = 'BASE TABLE' and table_schema not in ('pg_catalog', 'information_schema') order by 1`,
    );
    const counts: Record<string, number> = {};
    for (const { name } of tables) counts[name] = Number((await c.query(`select count(*) as n from ${name}`)).rows[0].n);
    return counts;
  });
}

/** A digest of a table's whole contents, independent of row order. */
async function checksum(database: string, table: string): Promise<string> {
  return withClient(database, async (c) => {
    const { rows } = await c.query(`select md5(coalesce(string_agg(t::text, '|' order by t::text), '')) as sum from ${table} t`);
    return rows[0].sum as string;
  });
}

afterAll(async () => {
  await withClient("postgres", (c) => c.query(`drop database if exists ${restoredDb} with (force)`));
  rmSync(dir, { recursive: true, force: true });
});

describe("db:backup and db:restore", () => {
  it("restores every row into a fresh database", async () => {
    const env = { ...process.env, WINDOWCALL_DB: sourceDb };
    const printed = execFileSync("bash", ["scripts/backup.sh", file], { env, encoding: "utf8" });
    expect(printed.trim().split("\n").at(-1)).toBe(file);
    const before = await rowCounts(sourceDb);
    execFileSync("bash", ["scripts/restore.sh", file, restoredDb], { env, encoding: "utf8" });

    const after = await rowCounts(restoredDb);
    expect(Object.keys(before).length).toBeGreaterThan(5);
    expect(before["public.users"]).toBeGreaterThan(0);
    expect(after).toEqual(before);
    for (const table of ["users", "events", "runs", "field_sessions", "run_lanes"]) {
      expect(await checksum(restoredDb, table), table).toBe(await checksum(sourceDb, table));
    }
  });

  it("refuses to replace a database that is in use, and leaves it as it was", async () => {
    const env = { ...process.env, WINDOWCALL_DB: sourceDb };
    await withClient(restoredDb, async () => {
      const run = () => execFileSync("bash", ["scripts/restore.sh", file, restoredDb], { env, encoding: "utf8", stdio: "pipe" });
      expect(run).toThrow(/in use/);
    });
    const { rows } = await withClient("postgres", (c) =>
      c.query<{ datname: string }>("select datname from pg_database where datname like $1", [`${restoredDb}%`]),
    );
    expect(rows.map((r) => r.datname)).toEqual([restoredDb]);
  });
});
