/**
 * The big-run measure of bench/sync.bench.ts alone (about 30 s), for turns against another build of the
 * code: one account pushes a SYNC_BENCH_BIG_RUN-event run (5,000) in batches of 200 while 4 other accounts
 * push small runs; prints their p50 with and without it and the floor (the same events as raw inserts).
 * `npx tsx --conditions=react-server bench/sync-big-run.ts` with DATABASE_URL set to a migrated database
 * (the bench's own, windowcall_bench: scripts/bench.sh makes one; never windowcall_test). `SYNC_BIG_RUN_TURNS`
 * repeats the measure (default 1), each with fresh accounts. Each turn also pushes the same run alone and prints how
 * long the event loop was held (delay of a 1 ms timer: p99 and max) and the Node process's CPU per push: what the
 * other accounts wait on, far less noisy than their p50 on a loaded machine. `SYNC_GATE_REST_FACTORS=1,2,3` (tuning the
 * push gate, lib/sync/push-gate.ts) measures each turn once per rest factor, in that order; by default the gate's own.
 */
import "./scratch-db";
import os from "node:os";
import { monitorEventLoopDelay } from "node:perf_hooks";
import { db, getPool } from "@/db";
import { createSimUsers } from "../tests/integration/sync-sim";
import { pushGate } from "@/lib/sync/push-gate";
import { bigRun, gateSince, pushOk } from "./sync-measures";
import { deviceWorkload } from "./sync-workload";

/** The run pushed alone: event-loop delay while it runs, and CPU per push. */
async function alone(user: string): Promise<string> {
  const pushes = deviceWorkload(user, 1, SIZE, 200);
  const h = monitorEventLoopDelay({ resolution: 1 });
  const cpu0 = process.cpuUsage();
  const gate0 = pushGate.stats();
  const t0 = performance.now();
  h.enable();
  for (const p of pushes) await pushOk(user, p);
  h.disable();
  const wall = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  const ms = (ns: number) => (ns / 1e6).toFixed(1);
  return `alone: ${(wall / 1000).toFixed(1)} s, Node CPU ${((cpu.user + cpu.system) / 1000 / pushes.length).toFixed(1)} ms a push; ` +
    `event loop held p50 ${ms(h.percentile(50))} p99 ${ms(h.percentile(99))} max ${ms(h.max)} ms; ${gateSince(gate0)}`;
}

const SIZE = Number(process.env.SYNC_BENCH_BIG_RUN ?? 5_000);
const TURNS = Number(process.env.SYNC_BIG_RUN_TURNS ?? 1);
const FACTORS = (process.env.SYNC_GATE_REST_FACTORS ?? String(pushGate.policy.restFactor)).split(",").map(Number);
try {
  for (let t = 0; t < TURNS; t++) for (const f of FACTORS) {
    pushGate.policy.restFactor = f;
    if (FACTORS.length > 1) console.log(`rest factor ${f}`);
    const load = os.loadavg()[0]!.toFixed(1);
    const [big, lone, ...rest] = (await createSimUsers(db, 6)).map((u) => u.id);
    console.log(`load ${load}: ${await alone(lone!)}`);
    const m = await bigRun(big!, rest, SIZE);
    console.log(`  ${m.line}`);
    console.log(`  floor ${m.floor}`);
  }
} finally {
  await getPool().end();
}
