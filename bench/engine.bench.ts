/**
 * Engine benchmark: `npx tsx bench/engine.bench.ts`.
 * Deterministic seeded data; each workload is timed with performance.now() over several
 * repetitions (best kept) and compared with a plain loop that only sums the same flights —
 * the floor for this work. Ratios are measured in this one run.
 */
import { CATALOGUE, foldRun, scoreTask, type FlightInput, type TaskDefinition, type TimelineEvent } from "@/lib/tasks";
import { rankPilots, scoreRound, type GroupResult } from "@/lib/scoring";
import { mulberry32 } from "@/lib/random";

const rand = mulberry32(20250501);
const int = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1));

function time(label: string, reps: number, fn: () => number): { ms: number; sink: number } {
  let best = Infinity;
  let sink = 0;
  for (let r = 0; r < reps; r++) {
    const t0 = performance.now();
    sink += fn();
    const dt = performance.now() - t0;
    if (dt < best) best = dt;
  }
  void label;
  return { ms: best, sink };
}

// ---- 10,000 scored runs ----
const RUNS = 10_000;
const defs: TaskDefinition[] = Object.values(CATALOGUE).flat();
const runs = Array.from({ length: RUNS }, () => {
  const def = defs[int(0, defs.length - 1)]!;
  const n = def.kind === "all-up" ? def.attempts : int(3, 10);
  let t = int(-500, 2000);
  const flights: FlightInput[] = [];
  for (let i = 0; i < n; i++) {
    const dur = int(20_000, 200_000);
    if (def.kind === "all-up") flights.push({ launchMs: int(0, 3200), landMs: int(30_000, 215_000) });
    else flights.push({ launchMs: t, landMs: t + dur, targetSec: int(30, 120) });
    t += dur + int(300, 5000);
  }
  const events: TimelineEvent[] = [];
  let k = 0;
  const id = () => `00000000-0000-7000-8000-${String(k++).padStart(12, "0")}`;
  if (def.kind === "all-up") for (let a = 0; a < def.attempts; a++) events.push({ id: id(), atMs: a * 1e7, body: { kind: "window-start" } });
  else events.push({ id: id(), atMs: 0, body: { kind: "window-start" } });
  flights.forEach((f, i) => {
    const base = def.kind === "all-up" ? i * 1e7 : 0;
    if (def.kind === "poker") events.push({ id: id(), atMs: base + f.launchMs, body: { kind: "target", lane: 0, targetSec: f.targetSec! } });
    events.push({ id: id(), atMs: base + f.launchMs, body: { kind: "launch", lane: 0 } });
    events.push({ id: id(), atMs: base + f.landMs!, body: { kind: "landing", lane: 0 } });
  });
  return { def, flights, events };
});

const REPS = 7;
const floorRuns = time("floor", REPS, () => {
  let s = 0;
  for (const r of runs) for (const f of r.flights) s += (f.landMs ?? f.launchMs) - f.launchMs;
  return s;
});
const scored = time("scoreTask", REPS, () => {
  let s = 0;
  for (const r of runs) s += scoreTask({ task: r.def, flights: r.flights }).tenths;
  return s;
});
const folded = time("foldRun", REPS, () => {
  let s = 0;
  for (const r of runs) s += foldRun(r.def, r.events).lanes[0]!.resultTenths;
  return s;
});

// ---- 200 pilots × 20 rounds ----
const PILOTS = 200;
const ROUNDS = 20;
const GROUP = 10;
const pilots = Array.from({ length: PILOTS }, (_, i) => `pilot-${i}`);
const rounds: GroupResult[][][] = Array.from({ length: ROUNDS }, () => {
  const order = [...pilots].sort(() => rand() - 0.5);
  const groups: GroupResult[][] = [];
  for (let g = 0; g < PILOTS / GROUP; g++) {
    groups.push(order.slice(g * GROUP, (g + 1) * GROUP).map((pilotId) => ({ pilotId, resultTenths: int(0, 5990) })));
  }
  return groups;
});
const penalties = new Map(pilots.map((p) => [p, rand() < 0.05 ? 100 : 0]));

const CONTEST_REPS = 25;
const floorContest = time("floor", CONTEST_REPS, () => {
  let s = 0;
  for (const round of rounds) for (const group of round) for (const g of group) s += g.resultTenths;
  return s;
});
const contest = time("contest", CONTEST_REPS, () => {
  const perPilot = new Map<string, number[]>(pilots.map((p) => [p, []]));
  for (const round of rounds) {
    for (const [pilotId, tenths] of scoreRound(round)) perPilot.get(pilotId)!.push(tenths / 10);
  }
  const standings = rankPilots(pilots.map((pilotId) => ({ pilotId, rounds: perPilot.get(pilotId)!, penalties: penalties.get(pilotId)! })));
  return standings[0]!.totalTenths;
});

const us = (ms: number, n: number) => ((ms * 1000) / n).toFixed(2);
const line = (label: string, n: number, unit: string, ms: number, floorMs: number) =>
  console.log(`${label}: ${n} ${unit}s  ${us(ms, n)} µs/${unit}  floor ${us(floorMs, n)} µs/${unit}  ratio ${(ms / floorMs).toFixed(0)}×`);

line("engine (scoreTask)", RUNS, "run", scored.ms, floorRuns.ms);
line("engine (foldRun from events)", RUNS, "run", folded.ms, floorRuns.ms);
console.log(
  `contest: ${PILOTS} pilots × ${ROUNDS} rounds  ${(contest.ms * 1000).toFixed(0)} µs/contest  floor ${(floorContest.ms * 1000).toFixed(1)} µs/contest  ratio ${(contest.ms / floorContest.ms).toFixed(0)}×`,
);
if (!Number.isFinite(scored.sink + folded.sink + contest.sink + floorRuns.sink + floorContest.sink)) process.exitCode = 1;
