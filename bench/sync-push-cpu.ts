/**
 * The Node process's CPU time per push (process.cpuUsage: the time a push keeps the event loop from
 * every other push and pull in the same process, not inflated when the machine is loaded, unlike wall
 * time): `npx tsx --conditions=react-server bench/sync-push-cpu.ts [through|long|small]` with DATABASE_URL
 * set to a migrated database. Shapes: `through` pushes of 200 events (new runs of 100, as the throughput
 * measure sends them), `long` pushes of 200 into one run of 5,000 and more, `small` pushes of 10 into
 * runs of 50. A few pushes warm up first; `SYNC_CPU_PROFILE=dir` also writes a CPU profile (100 µs
 * sampling) of the measured pushes into dir.
 */
import "./scratch-db";
import fs from "node:fs";
import { Session } from "node:inspector/promises";
import { db, getPool } from "@/db";
import { applyPush } from "@/db/queries/sync-push";
import { createSimUsers } from "../tests/integration/sync-sim";
import { deviceWorkload } from "./sync-workload";

const mode = process.argv[2] ?? "through";
const out = process.env.SYNC_CPU_PROFILE;
const [user] = await createSimUsers(db, 1);
const uid = user!.id;
const shapes: Record<string, () => [ReturnType<typeof deviceWorkload>, number]> = {
  through: () => [deviceWorkload(uid, 60, 100, 200), 5],
  long: () => [deviceWorkload(uid, 1, 5_000 + 200 * 20, 200), 25],
  small: () => [deviceWorkload(uid, 20, 50, 10), 10],
};
if (!shapes[mode]) throw new Error(`no shape ${mode}: through, long or small`);
const [work, warm] = shapes[mode]();
try {
  for (const p of work.slice(0, warm)) await applyPush(db, uid, p);
  const session = new Session();
  if (out) {
    session.connect();
    await session.post("Profiler.enable");
    await session.post("Profiler.setSamplingInterval", { interval: 100 });
    await session.post("Profiler.start");
  }
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  for (const p of work.slice(warm)) await applyPush(db, uid, p);
  const cpu = process.cpuUsage(cpu0);
  const n = work.length - warm;
  console.log(`${mode}: ${n} pushes, ${((performance.now() - t0) / n).toFixed(1)} ms each, Node process CPU ${((cpu.user + cpu.system) / 1000 / n).toFixed(1)} ms each`);
  if (out) {
    const { profile } = await session.post("Profiler.stop");
    fs.mkdirSync(out, { recursive: true });
    fs.writeFileSync(`${out}/push-${mode}.cpuprofile`, JSON.stringify(profile));
  }
} finally {
  await getPool().end();
}
