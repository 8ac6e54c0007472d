/**
 * Where a push's time goes: `npx tsx --conditions=react-server bench/sync-profile.ts` (DATABASE_URL
 * set to a migrated database; `npm run bench` does not run it). Counts the statements (round trips)
 * of one push and times each, for a small push into a new run and for a 200-event push into a run
 * that already holds `SYNC_PROFILE_RUN` events (4,800), then `SYNC_PROFILE_BIG` (5) more such pushes, each with the
 * WAL it wrote (pg_current_wal_lsn before and after: bytes written, a proxy that load does not move; the
 * whole cluster's, so run it alone on its cluster), and their median time and WAL.
 */
import "./scratch-db";
import { Client, Pool } from "pg";
import { db, getPool } from "@/db";
import { applyPush } from "@/db/queries/sync-push";
import { createSimUsers } from "../tests/integration/sync-sim";
import { deviceWorkload } from "./sync-workload";

const RUN = Number(process.env.SYNC_PROFILE_RUN ?? 4_800);
type Stat = { text: string; ms: number };
let log: Stat[] | null = null;

// time every statement any pooled client sends (the pool hands out pg.Client instances)
const query = Client.prototype.query as (...args: unknown[]) => unknown;
Client.prototype.query = function timed(this: Client, ...args: unknown[]) {
  const first = args[0] as string | { text?: string };
  const text = (typeof first === "string" ? first : (first?.text ?? "?")).replace(/\s+/g, " ").slice(0, 90);
  const t0 = performance.now();
  const out = query.apply(this, args);
  if (log && out instanceof Promise) {
    const mine = log;
    void out.then(() => mine.push({ text, ms: performance.now() - t0 }), () => mine.push({ text: `FAILED ${text}`, ms: performance.now() - t0 }));
  }
  return out;
} as typeof Client.prototype.query;

const BIG = Number(process.env.SYNC_PROFILE_BIG ?? 5);

async function walLsn(): Promise<bigint> {
  const r = await getPool().query<{ b: string }>("select (pg_current_wal_lsn() - '0/0'::pg_lsn)::bigint::text as b");
  return BigInt(r.rows[0]!.b);
}

async function profile(label: string, run: () => Promise<unknown>, quiet = false): Promise<{ ms: number; wal: number; statements: number; store: number }> {
  const w0 = await walLsn();
  log = [];
  const t0 = performance.now();
  await run();
  const total = performance.now() - t0;
  const stats = log;
  log = null;
  const wal = Number((await walLsn()) - w0);
  const inDb = stats.reduce((s, x) => s + x.ms, 0);
  console.log(`${label}: ${total.toFixed(1)} ms, ${stats.length} statements (round trips) taking ${inDb.toFixed(1)} ms; the rest (${(total - inDb).toFixed(1)} ms) in JavaScript; WAL ${(wal / 1024).toFixed(1)} kB`);
  if (!quiet) for (const s of stats) console.log(`  ${s.ms.toFixed(2).padStart(8)} ms  ${s.text}`);
  // the statement that stores the derivations (db/queries/runs.ts storeDerivations)
  const store = stats.filter((x) => x.text.startsWith("with restamp")).reduce((sum, x) => sum + x.ms, 0);
  return { ms: total, wal, statements: stats.length, store };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

const [user] = await createSimUsers(db, 1);
const uid = user!.id;
try {
  const small = deviceWorkload(uid, 1, 10, 12);
  await profile("first push of a device (session, run, 10 events)", () => applyPush(db, uid, small[0]!));
  const next = deviceWorkload(uid, 1, 30, 12);
  await applyPush(db, uid, next[0]!);
  await profile("a push of 10 events into a run with 10", () => applyPush(db, uid, next[1]!));
  const through = deviceWorkload(uid, 6, 100, 200); // the throughput bench's shape: runs of 100, pushes of 200
  for (const p of through.slice(0, 2)) await applyPush(db, uid, p);
  await profile("a push of 200 items (runs of 100) as the throughput bench sends them", () => applyPush(db, uid, through[2]!));
  const big = deviceWorkload(uid, 1, RUN + 200 * BIG, 200);
  const t0 = performance.now();
  const before = big.length - BIG;
  for (const p of big.slice(0, before)) await applyPush(db, uid, p);
  console.log(`(stored a ${RUN}-event run in ${((performance.now() - t0) / 1000).toFixed(1)} s)`);
  const runs = [];
  for (let i = before; i < big.length; i++) runs.push(await profile(`a push of 200 events into a run with ${i * 200}`, () => applyPush(db, uid, big[i]!), i > before));
  console.log(`pushes of 200 into the long run: median ${median(runs.map((r) => r.ms)).toFixed(1)} ms, WAL median ${(median(runs.map((r) => r.wal)) / 1024).toFixed(1)} kB, ${median(runs.map((r) => r.statements))} statements; the statement storing the derivation: median ${median(runs.map((r) => r.store)).toFixed(1)} ms`);
} finally {
  await getPool().end();
}
void Pool;
