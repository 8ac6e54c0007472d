/**
 * Only the push-throughput measure of bench/sync.bench.ts, TURNS times (default 3), each with a fresh user:
 * `npx tsx --conditions=react-server bench/sync-throughput.ts` with DATABASE_URL set to a migrated database
 * (never windowcall_test). For comparing two checkouts in alternating turns, each on a fresh copy of its migrated
 * database. Beside the ratio it prints the load and the CPU time the turn took (pushes and raw inserts together) in
 * this Node process and in this database's PostgreSQL backends (from /proc: run it on the database's machine) —
 * work that a loaded machine inflates far less than wall time.
 */
import fs from "node:fs";
import os from "node:os";
import "./scratch-db";
import { db, getPool } from "@/db";
import { createSimUsers } from "../tests/integration/sync-sim";
import { throughput } from "./sync-measures";

const EVENTS = Number(process.env.SYNC_BENCH_EVENTS ?? 10_000);
const TURNS = Number(process.env.TURNS ?? 3);
const TICK_MS = 1000 / 100; // USER_HZ

/** CPU ms (user + system) of this database's backends, by pid. */
async function backendCpu(): Promise<Map<number, number>> {
  const r = await getPool().query<{ pid: number }>("select pid from pg_stat_activity where datname = current_database()");
  const out = new Map<number, number>();
  for (const { pid } of r.rows) {
    try {
      const f = fs.readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1]!.split(" ");
      out.set(pid, (Number(f[11]) + Number(f[12])) * TICK_MS);
    } catch {
      // not on this machine, or gone
    }
  }
  return out;
}

try {
  for (let i = 0; i < TURNS; i++) {
    const [user] = await createSimUsers(db, 1);
    const before = await backendCpu();
    const cpu0 = process.cpuUsage();
    const m = await throughput(user!.id, EVENTS);
    const cpu = process.cpuUsage(cpu0);
    const after = await backendCpu();
    let pg = 0;
    for (const [pid, ms] of after) pg += ms - (before.get(pid) ?? 0);
    console.log(`load ${os.loadavg()[0]!.toFixed(2)}  ${m.line}; CPU ms: node ${((cpu.user + cpu.system) / 1000).toFixed(0)}, postgres ${pg.toFixed(0)}`);
  }
} finally {
  await getPool().end();
}
