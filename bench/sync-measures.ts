import { sql } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { db, getPool } from "@/db";
import { listChanges } from "@/db/queries/sync-pull";
import { applyPush } from "@/db/queries/sync-push";
import { correctStamp } from "@/lib/sync/correct-events";
import { pushGate, type PushGateStats } from "@/lib/sync/push-gate";
import type { PushRequest } from "@/lib/validations/sync";
import { deviceWorkload, percentile } from "./sync-workload";

/** The three sync measurements of bench/sync.bench.ts; each returns what it prints. */

export type Measure = { line: string; goal: string; met: boolean };

const ms = (n: number) => `${n.toFixed(1)} ms`;

/** Push one request and fail loudly on any refusal (the bench's items are all allowed). */
export async function pushOk(userId: string, p: PushRequest): Promise<void> {
  const reply = await applyPush(db, userId, p);
  const bad = reply.acks.find((a) => a.status === "rejected");
  if (bad) throw new Error(`bench push refused an item: ${bad.reason}`);
}

/** Raw rows' devices: the pushing device's id behind this prefix (a device's seqs are unique). */
const RAW = "raw-";

/** One raw multi-row insert of a push's events into `events` (new ids, device `raw-<its device>`): no checks, no derivation. */
async function rawInsert(userId: string, p: PushRequest): Promise<void> {
  if (p.events.length === 0) return;
  const rawDevice = RAW + p.deviceId;
  const rows = p.events.map((e) => {
    const c = correctStamp(e.stamp, []);
    return sql`(${uuidv7()}::uuid, ${e.runId}::uuid, ${rawDevice}, ${e.seq}, ${userId}::uuid, ${e.body.kind}, ${JSON.stringify(e.body)}::jsonb,
      ${e.stamp.wallMs}, ${e.stamp.monoMs}, ${e.stamp.pageId}, ${e.stamp.offset?.thetaMs ?? null}, ${e.stamp.offset?.deltaMs ?? null},
      ${e.stamp.offset?.measuredAtWallMs ?? null}, ${c.correctedMs}, ${c.uncertaintyMs})`;
  });
  await db.execute(sql`insert into events (id, run_id, device_id, seq, recorded_by, kind, body, wall_ms, mono_ms, page_id,
    offset_theta_ms, offset_delta_ms, offset_measured_at_ms, corrected_ms, uncertainty_ms) values ${sql.join(rows, sql`, `)}`);
}

/** Deletes every raw row, so the next measure starts from what the pushes stored. */
const dropRaw = () => db.execute(sql`delete from events where starts_with(device_id, ${RAW})`);

/**
 * 1. Push throughput: `events` events (runs of 100) through applyPush — validation,
 * authorisation, storing, derivation — in the phone's batches of 200, against raw multi-row
 * inserts of the same rows into the same table, same batches, no checks.
 */
export async function throughput(userId: string, events: number): Promise<Measure> {
  const pushes = deviceWorkload(userId, Math.ceil(events / 100), 100, 200);
  const t0 = performance.now();
  for (const p of pushes) await pushOk(userId, p);
  const pushMs = performance.now() - t0;

  // the same rows again (new ids, another device, the same runs) as plain multi-row inserts into
  // the events table itself — same indexes, same foreign keys — with no checks and no derivation
  const t1 = performance.now();
  for (const p of pushes) await rawInsert(userId, p);
  const rawMs = performance.now() - t1;
  await dropRaw();
  const n = pushes.reduce((k, p) => k + p.events.length, 0);
  const ratio = rawMs / pushMs;
  return {
    line: `push ${n} events in ${pushes.length} pushes: ${(n / (pushMs / 1000)).toFixed(0)} events/s; raw multi-row insert ` +
      `${(n / (rawMs / 1000)).toFixed(0)} events/s; push throughput = ${ratio.toFixed(2)}× the raw insert`,
    goal: "≥ 0.5×",
    met: ratio >= 0.5,
  };
}

type Crowd = { wall: number; latencies: number[]; pulls: number[]; errors: number };

/** Every device sends its requests in turn through `send`, all devices at once, while `readerCount` phones of those accounts pull again and again. */
async function crowdOf(work: { user: string; pushes: PushRequest[] }[], readerUsers: string[], send: (user: string, p: PushRequest) => Promise<void>): Promise<Crowd> {
  const latencies: number[] = [];
  const pulls: number[] = [];
  let errors = 0;
  let done = false;
  const readers = readerUsers.map(async (userId) => {
    // a phone of that account: pulls what changed since its cursor, again and again
    let cursor = "0";
    while (!done) {
      const start = performance.now();
      try {
        for (let more = true; more; ) {
          const page = await listChanges(db, { userId, cursor });
          cursor = page.nextCursor;
          more = page.hasMore;
        }
      } catch {
        errors += 1;
      }
      pulls.push(performance.now() - start);
      await new Promise((r) => setTimeout(r, 20));
    }
  });
  const t0 = performance.now();
  await Promise.all(
    work.map(async ({ user, pushes }) => {
      for (const p of pushes) {
        const start = performance.now();
        try {
          await send(user, p);
        } catch {
          errors += 1;
        }
        latencies.push(performance.now() - start);
      }
    }),
  );
  const wall = performance.now() - t0;
  done = true;
  await Promise.all(readers);
  latencies.sort((a, b) => a - b);
  pulls.sort((a, b) => a - b);
  return { wall, latencies, pulls, errors };
}

const crowdLine = (c: Crowd) =>
  `(${c.pulls.length} pulls, p50 ${ms(percentile(c.pulls, 0.5))}): ${(c.wall / 1000).toFixed(1)} s, ` +
  `p50 ${ms(percentile(c.latencies, 0.5))} p99 ${ms(percentile(c.latencies, 0.99))}, errors ${c.errors}`;

/**
 * 2. `devices` devices each pushing one run of `perDevice` events at once, while `readerCount` phones
 * of those accounts pull what changed since their cursor, again and again. Pushes of `batch` items: 10
 * (the goal's measure: six pushes a device, the harder case), or the phone's own PUSH_BATCH_SIZE (its
 * outbox sends everything waiting in one push: lib/offline/push.ts), printed beside it for reference.
 * `floor` is what this machine does with the same shape and no application at all: the same events again
 * (new ids, into the runs the pushes made) as raw multi-row inserts into `events`, a statement per push, every
 * device at once through the same pool while the readers pull — the p99 no push can beat here.
 */
export async function crowd(userIds: string[], readerCount: number, devices: number, perDevice: number, batch = 10): Promise<Measure & { floor: string }> {
  const work = Array.from({ length: devices }, (_, i) => ({ user: userIds[i % userIds.length]!, pushes: deviceWorkload(userIds[i % userIds.length]!, 1, perDevice, batch) }));
  const readerUsers = Array.from({ length: readerCount }, (_, i) => userIds[i % userIds.length]!);
  const pushed = await crowdOf(work, readerUsers, pushOk);
  const raw = await crowdOf(work, readerUsers, (user, p) => rawInsert(user, p));
  await dropRaw();
  const p99 = percentile(pushed.latencies, 0.99);
  return {
    line: `${devices} devices × ${perDevice} events at once (${pushed.latencies.length} pushes of ≤ ${batch} items, pool of ${getPool().options.max}) ` +
      `while ${readerCount} readers pull ${crowdLine(pushed)}`,
    floor: `the same events as raw multi-row inserts, a statement per push, at once with the same readers ${crowdLine(raw)}`,
    goal: "0 errors, p99 ≤ 500 ms",
    met: pushed.errors === 0 && p99 <= 500,
  };
}

/**
 * How many runs each of the others has pushed: past 180 on a day they move to the next day (a long big run under load
 * let them reach the server's 200 runs a day, and the measure stopped with a refusal).
 */
const othersRuns = new Map<string, number>();

/** Other accounts pushing small runs (batches of 10) until `until` resolves or `minPushes` each; their latencies. */
async function others(userIds: string[], until: Promise<unknown> | null, minPushes: number): Promise<number[]> {
  const out: number[] = [];
  let over = until === null;
  void until?.then(() => (over = true));
  await Promise.all(
    userIds.map(async (u) => {
      let n = 0;
      while (n < minPushes || !over) {
        const runs = othersRuns.get(u) ?? 0;
        othersRuns.set(u, runs + 2);
        for (const p of deviceWorkload(u, 2, 20, 10, Math.floor(runs / 180))) {
          const start = performance.now();
          await pushOk(u, p);
          out.push(performance.now() - start);
          n += 1;
        }
      }
    }),
  );
  return out.sort((a, b) => a - b);
}

/** Other accounts' p50 while `load` runs, over their p50 alone; and how long `load` took. */
async function slowdown(otherIds: string[], alone: number[], load: () => Promise<void>): Promise<{ ratio: number; withLoad: number[]; loadMs: number }> {
  const t0 = performance.now();
  const running = load().then(() => performance.now() - t0);
  const withLoad = await others(otherIds, running, 10);
  const loadMs = await running;
  return { ratio: percentile(withLoad, 0.5) / percentile(alone, 0.5), withLoad, loadMs };
}

/**
 * 3. One account pushing a `size`-event run (batches of 200) against other accounts' push p50, with and without it.
 * `floor`: the same with the big run's events stored by raw multi-row inserts (its first push, which makes the
 * session and run, goes through applyPush; the rest are plain inserts of the same batches): what storing that many
 * events costs the others on this machine with no application work at all.
 */
export async function bigRun(bigUser: string, otherIds: string[], size: number): Promise<Measure & { floor: string }> {
  const alone = await others(otherIds, null, 40);
  const gate0 = pushGate.stats();
  const pushed = await slowdown(otherIds, alone, async () => {
    for (const p of deviceWorkload(bigUser, 1, size, 200)) await pushOk(bigUser, p);
  });
  const gate = gateSince(gate0);
  const raw = await slowdown(otherIds, alone, async () => {
    const [first, ...rest] = deviceWorkload(bigUser, 1, size, 200);
    await pushOk(bigUser, first!);
    for (const p of rest) await rawInsert(bigUser, p);
  });
  await dropRaw();
  const p50s = (r: { withLoad: number[]; ratio: number }) =>
    `their p50 ${ms(percentile(r.withLoad, 0.5))} (p99 ${ms(percentile(r.withLoad, 0.99))}) against ${ms(percentile(alone, 0.5))} alone = ${r.ratio.toFixed(2)}×`;
  return {
    line: `one account pushes a ${size}-event run (${(pushed.loadMs / 1000).toFixed(1)} s) while ${otherIds.length} others push: ` +
      `${p50s(pushed)} (alone p99 ${ms(percentile(alone, 0.99))}); ${gate}`,
    floor: `the same run's events as raw multi-row inserts (${(raw.loadMs / 1000).toFixed(1)} s): ${p50s(raw)}`,
    goal: "≤ 1.2×",
    met: pushed.ratio <= 1.2,
  };
}

/** What the push gate (lib/sync/push-gate.ts) made bulk pushes wait since `from`. */
export function gateSince(from: PushGateStats): string {
  const to = pushGate.stats();
  const n = to.bulkPushes - from.bulkPushes;
  return `${n} bulk pushes waited ${((to.waitedMs - from.waitedMs) / 1000).toFixed(1)} s for small ones (longest wait so far ${to.longestWaitMs.toFixed(0)} ms)`;
}
