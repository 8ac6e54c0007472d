/**
 * Where the crowd measure's time goes: `npx tsx --conditions=react-server bench/sync-crowd-profile.ts`
 * (DATABASE_URL set to a migrated database; `npm run bench` does not run it). Runs bench/sync-measures.ts
 * `crowd` (SYNC_BENCH_DEVICES devices × 50 events, 20 readers) with every statement timed, and prints the
 * statements grouped by their first words: count, total and mean milliseconds (round trip as the
 * client sees it, queueing on the server included).
 */
import "./scratch-db";
import { Client } from "pg";
import { db, getPool } from "@/db";
import { createSimUsers } from "../tests/integration/sync-sim";
import { crowd } from "./sync-measures";

const DEVICES = Number(process.env.SYNC_BENCH_DEVICES ?? 100);
const groups = new Map<string, { n: number; ms: number }>();
const query = Client.prototype.query as (...args: unknown[]) => unknown;
Client.prototype.query = function timed(this: Client, ...args: unknown[]) {
  const first = args[0] as string | { text?: string };
  const text = (typeof first === "string" ? first : (first?.text ?? "?")).replace(/\s+/g, " ").trim().slice(0, 60);
  const t0 = performance.now();
  const out = query.apply(this, args);
  if (out instanceof Promise) {
    const done = () => {
      const g = groups.get(text) ?? { n: 0, ms: 0 };
      g.n += 1;
      g.ms += performance.now() - t0;
      groups.set(text, g);
    };
    void out.then(done, done);
  }
  return out;
} as typeof Client.prototype.query;

try {
  const users = (await createSimUsers(db, 10)).map((u) => u.id);
  groups.clear();
  const m = await crowd(users, 20, DEVICES, 50);
  console.log(m.line);
  const all = [...groups].sort((a, b) => b[1].ms - a[1].ms);
  const total = all.reduce((s, [, g]) => s + g.ms, 0);
  console.log(`${all.reduce((s, [, g]) => s + g.n, 0)} statements, ${total.toFixed(0)} ms in all`);
  for (const [text, g] of all.slice(0, 30)) console.log(`${String(g.n).padStart(6)} ${g.ms.toFixed(0).padStart(8)} ms ${(g.ms / g.n).toFixed(1).padStart(7)} ms  ${text}`);
} finally {
  await getPool().end();
}
