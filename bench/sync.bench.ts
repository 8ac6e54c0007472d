/**
 * Sync benchmark: `npm run bench` (or `npx tsx --conditions=react-server bench/sync.bench.ts` with
 * DATABASE_URL set to a migrated database; it creates its own users, club and rows). In one run,
 * each measure printed beside its goal (SYNC.md §5, issue "Sync at club scale"):
 *  1. push throughput of 10,000 events against a raw multi-row insert of the same rows;
 *  2. 100 devices × 50 events pushing at once (batches of 10) while 20 readers pull: errors, p50/p99; then the
 *     same as the phone's outbox batches them (one push a device), printed for reference;
 *  3. one account pushing a 5,000-event run: other accounts' push p50 with and without it;
 *  4. the seeded sync fault run (tests/integration/sync-sim*.ts) over SYNC_BENCH_RUNS runs (1,000).
 * The route handlers' work runs in process (bench/sync-serve.ts), without next-auth.
 */
import "fake-indexeddb/auto";
import os from "node:os";
import fc from "fast-check";
import { db, getPool } from "@/db";
import { createSimUsers } from "../tests/integration/sync-sim";
import { runScenario, scenarioArb } from "../tests/integration/sync-sim-run";
import { PUSH_BATCH_SIZE } from "@/lib/validations/sync";
import { bigRun, crowd, throughput, type Measure } from "./sync-measures";
import { serveInProcess } from "./sync-serve";

const EVENTS = Number(process.env.SYNC_BENCH_EVENTS ?? 10_000);
const DEVICES = Number(process.env.SYNC_BENCH_DEVICES ?? 100);
const BIG_RUN = Number(process.env.SYNC_BENCH_BIG_RUN ?? 5_000);
const PROPERTY_RUNS = Number(process.env.SYNC_BENCH_RUNS ?? 1000);
const SEED = Number(process.env.SYNC_PROPERTY_SEED ?? 20260308);

const show = (m: Measure) => console.log(`${m.met ? "  met " : "MISSED"}  ${m.line}   [goal ${m.goal}]`);

async function property(): Promise<Measure> {
  let events = 0;
  let faults = 0;
  const t0 = performance.now();
  await fc.assert(
    fc.asyncProperty(scenarioArb, async (scenario) => {
      const outcome = await runScenario(db, serveInProcess, scenario);
      if (outcome.problems.length > 0) throw new Error(outcome.problems.join("\n"));
      events += outcome.events;
      faults += outcome.faults;
    }),
    { numRuns: PROPERTY_RUNS, seed: SEED },
  );
  return {
    line: `sync fault run (seed ${SEED}): ${PROPERTY_RUNS} seeded runs of 3–5 devices, ${events} events, ${faults} injected faults: ` +
      `0 lost, 0 duplicated, every device converged (${((performance.now() - t0) / 1000).toFixed(0)} s)`,
    goal: "0 lost, 0 duplicated",
    met: true,
  };
}

const cpus = os.cpus();
console.log(`machine: ${cpus.length} cores (${cpus[0]?.model.trim() ?? "?"}), ${(os.totalmem() / 2 ** 30).toFixed(1)} GB RAM, load ${os.loadavg()[0]!.toFixed(2)}`);
try {
  const fresh = async (n: number) => (await createSimUsers(db, n)).map((u) => u.id);
  show(await throughput((await fresh(1))[0]!, EVENTS));
  const tens = await crowd(await fresh(10), 20, DEVICES, 50);
  show(tens);
  console.log(`  floor ${tens.floor}`);
  // the same crowd as the phone's outbox would send it: each device's 52 items (its session, run and 50 events) in one push (reference only)
  const phone = await crowd(await fresh(10), 20, DEVICES, 50, PUSH_BATCH_SIZE);
  console.log(`  ref   ${phone.line}   [as the phone batches; the goal is judged on the line above]`);
  console.log(`  floor ${phone.floor}`);
  const [big, ...rest] = await fresh(5);
  const bigOne = await bigRun(big!, rest, BIG_RUN);
  show(bigOne);
  console.log(`  floor ${bigOne.floor}`);
  if (PROPERTY_RUNS > 0) show(await property());
} finally {
  await getPool().end();
}
