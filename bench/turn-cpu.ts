import fs from "node:fs";
import { getPool } from "@/db";

/** The CPU a bench turn took, in this Node process and in this database's PostgreSQL backends (from /proc: run it on the database's machine). */
export type TurnCpu = { nodeMs: number; postgresMs: number };

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

/** Runs `turn` and returns its result with the CPU it took (backends opened during the turn count from zero). */
export async function withCpu<T>(turn: () => Promise<T>): Promise<{ result: T; cpu: TurnCpu }> {
  const before = await backendCpu();
  const cpu0 = process.cpuUsage();
  const result = await turn();
  const node = process.cpuUsage(cpu0);
  const after = await backendCpu();
  let postgresMs = 0;
  for (const [pid, ms] of after) postgresMs += ms - (before.get(pid) ?? 0);
  return { result, cpu: { nodeMs: (node.user + node.system) / 1000, postgresMs } };
}

/** "node N, postgres M" (ms). */
export const cpuText = (c: TurnCpu) => `node ${c.nodeMs.toFixed(0)}, postgres ${c.postgresMs.toFixed(0)}`;
