/**
 * Only the crowd measure of bench/sync.bench.ts (100 devices × 50 events in pushes of ≤ 10 while 20 readers pull,
 * then its floor), TURNS times (default 2), each line with the load and the CPU the turn took — pushes, pulls and the
 * floor's raw inserts together — in this Node process and in this database's PostgreSQL backends (from /proc: run it
 * on the database's machine): `npx tsx --conditions=react-server bench/sync-crowd-cpu.ts` with DATABASE_URL set to a
 * migrated database (never windowcall_test), or `npm run bench -- bench/sync-crowd-cpu.ts`. For two checkouts in
 * alternating turns, where a loaded machine makes the p99 swing more than the change does.
 */
import os from "node:os";
import "./scratch-db";
import { db, getPool } from "@/db";
import { createSimUsers } from "../tests/integration/sync-sim";
import { cpuText, withCpu } from "./turn-cpu";
import { crowd } from "./sync-measures";

const TURNS = Number(process.env.TURNS ?? 2);
const DEVICES = Number(process.env.SYNC_BENCH_DEVICES ?? 100);

try {
  const users = (await createSimUsers(db, 10)).map((u) => u.id);
  for (let i = 0; i < TURNS; i++) {
    // the pool's connections all open first, so every backend the turn uses is counted
    await Promise.all(Array.from({ length: getPool().options.max ?? 10 }, () => db.execute("select pg_sleep(0.05)")));
    const { result: m, cpu } = await withCpu(() => crowd(users, 20, DEVICES, 50));
    console.log(`load ${os.loadavg()[0]!.toFixed(2)}  ${m.line}\n  floor ${m.floor}\n  CPU ms (pushes, pulls and floor): ${cpuText(cpu)}`);
  }
} finally {
  await getPool().end();
}
