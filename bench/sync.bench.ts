/**
 * Sync benchmark: `npx tsx --conditions=react-server bench/sync.bench.ts` with DATABASE_URL
 * set (a migrated database; it creates its own users, club and rows). Three measurements,
 * all in this one run:
 *  1. push throughput: 10,000 events through applyPush (validation, authorisation, one insert
 *     each, derivation of results) against a raw multi-row insert of the same rows into a
 *     scratch table, same batches of 200 — the ratio is the cost of doing it properly;
 *  2. 100 devices pushing at once on the real pool: p50/p99 latency and errors (in process:
 *     the route handlers' parse + query functions, without next-auth, see bench/sync-serve.ts);
 *  3. the sync property test (tests/integration/sync-property.test.ts) over SYNC_BENCH_RUNS
 *     seeded runs (default 1,000).
 */
import "fake-indexeddb/auto";
import fc from "fast-check";
import { sql } from "drizzle-orm";
import { db, getPool } from "@/db";
import { applyPush } from "@/db/queries/sync-push";
import { correctStamp } from "@/lib/sync/correct-events";
import { createSimUsers } from "../tests/integration/sync-sim";
import { runScenario, scenarioArb } from "../tests/integration/sync-sim-run";
import { serveInProcess } from "./sync-serve";
import { deviceWorkload, percentile } from "./sync-workload";

const EVENTS = Number(process.env.SYNC_BENCH_EVENTS ?? 10_000);
const DEVICES = Number(process.env.SYNC_BENCH_DEVICES ?? 100);
const PROPERTY_RUNS = Number(process.env.SYNC_BENCH_RUNS ?? 1000);

async function throughput(userId: string) {
  const pushes = deviceWorkload(userId, EVENTS / 100, 100, 200);
  const t0 = performance.now();
  for (const p of pushes) {
    const reply = await applyPush(db, userId, p);
    if (reply.acks.some((a) => a.status !== "applied")) throw new Error("bench push refused an item");
  }
  const pushMs = performance.now() - t0;

  // the floor: the same event rows, same batches, one plain multi-row insert each, no checks
  await db.execute(sql`create table if not exists bench_scratch_events (like events)`);
  await db.execute(sql`truncate bench_scratch_events`);
  const again = deviceWorkload(userId, EVENTS / 100, 100, 200);
  const t1 = performance.now();
  for (const p of again) {
    if (p.events.length === 0) continue;
    const rows = p.events.map((e) => {
      const c = correctStamp(e.stamp, []);
      return sql`(${e.id}::uuid, ${e.runId}::uuid, ${e.deviceId}, ${e.seq}, ${userId}::uuid, ${e.body.kind}, ${JSON.stringify(e.body)}::jsonb,
        ${e.stamp.wallMs}, ${e.stamp.monoMs}, ${e.stamp.pageId}, ${e.stamp.offset?.thetaMs ?? null}, ${e.stamp.offset?.deltaMs ?? null},
        ${e.stamp.offset?.measuredAtWallMs ?? null}, ${c.correctedMs}, ${c.uncertaintyMs}, nextval('sync_seq'), now())`;
    });
    await db.execute(sql`insert into bench_scratch_events values ${sql.join(rows, sql`, `)}`);
  }
  const rawMs = performance.now() - t1;
  await db.execute(sql`drop table bench_scratch_events`);
  const events = pushes.reduce((n, p) => n + p.events.length, 0);
  console.log(
    `push throughput: ${events} events in ${pushes.length} pushes  ${(events / (pushMs / 1000)).toFixed(0)} events/s  ` +
      `raw insert ${(events / (rawMs / 1000)).toFixed(0)} events/s  ratio ${(pushMs / rawMs).toFixed(1)}× the raw insert`,
  );
}

async function concurrent(userIds: string[]) {
  const latencies: number[] = [];
  let errors = 0;
  const devices = Array.from({ length: DEVICES }, (_, i) => deviceWorkload(userIds[i % userIds.length]!, 2, 20, 10));
  const t0 = performance.now();
  await Promise.all(
    devices.map(async (pushes, i) => {
      for (const p of pushes) {
        const start = performance.now();
        try {
          const reply = await applyPush(db, userIds[i % userIds.length]!, p);
          if (reply.acks.some((a) => a.status === "rejected")) errors += 1;
        } catch {
          errors += 1;
        }
        latencies.push(performance.now() - start);
      }
    }),
  );
  const wall = performance.now() - t0;
  latencies.sort((a, b) => a - b);
  console.log(
    `${DEVICES} devices pushing at once (pool of ${getPool().options.max}): ${latencies.length} pushes in ${(wall / 1000).toFixed(1)} s  ` +
      `p50 ${percentile(latencies, 0.5).toFixed(1)} ms  p99 ${percentile(latencies, 0.99).toFixed(1)} ms  errors ${errors}  ` +
      `(p99/p50 ratio ${(percentile(latencies, 0.99) / percentile(latencies, 0.5)).toFixed(1)}×)`,
  );
}

async function property() {
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
    { numRuns: PROPERTY_RUNS, seed: Number(process.env.SYNC_PROPERTY_SEED ?? 20260308) },
  );
  console.log(
    `sync property: ${PROPERTY_RUNS} seeded runs of 3–5 devices, ${events} events, ${faults} injected faults: ` +
      `0 lost, 0 duplicated, every device converged  (${((performance.now() - t0) / 1000).toFixed(0)} s)`,
  );
}

try {
  const users = await createSimUsers(db, 10);
  await throughput(users[0]!.id);
  await concurrent(users.map((u) => u.id));
  await property();
} finally {
  await getPool().end();
}
