/**
 * Only the push-throughput measure of bench/sync.bench.ts, TURNS times (default 3), each with a fresh user:
 * `npx tsx --conditions=react-server bench/sync-throughput.ts` with DATABASE_URL set to a migrated database
 * (never windowcall_test). For comparing two checkouts in alternating turns, each on a fresh copy of its migrated
 * database. Beside the ratio it prints the load and the CPU time the turn took (pushes and raw inserts together) in
 * this Node process and in this database's PostgreSQL backends (from /proc: run it on the database's machine) —
 * work that a loaded machine inflates far less than wall time.
 */
import os from "node:os";
import "./scratch-db";
import { db, getPool } from "@/db";
import { createSimUsers } from "../tests/integration/sync-sim";
import { cpuText, withCpu } from "./turn-cpu";
import { throughput } from "./sync-measures";

const EVENTS = Number(process.env.SYNC_BENCH_EVENTS ?? 10_000);
const TURNS = Number(process.env.TURNS ?? 3);

try {
  for (let i = 0; i < TURNS; i++) {
    const [user] = await createSimUsers(db, 1);
    const { result: m, cpu } = await withCpu(() => throughput(user!.id, EVENTS));
    console.log(`load ${os.loadavg()[0]!.toFixed(2)}  ${m.line}; CPU ms: ${cpuText(cpu)}`);
  }
} finally {
  await getPool().end();
}
