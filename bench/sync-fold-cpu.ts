/**
 * The JavaScript of a push's derivation, without the database: `npx tsx --conditions=react-server
 * bench/sync-fold-cpu.ts` (add `--cpu-prof` to see where it goes). Times, as storeDerivations runs
 * them, (1) the full derivation and fold of new runs of 100 events (the throughput bench's push) and
 * (2) a resumed fold of 200 events into a run of SYNC_FOLD_RUN (5,000) — with the state read as
 * the database hands it (JSON.parse) and stored as it sends it (JSON.stringify). Median of `reps`.
 */
import { correctStamp } from "@/lib/sync/correct-events";
import { buildFold, lanesOfFold, resumeFold, type RunFold } from "@/lib/results/fold-state";
import { deriveRun, type DerivationEvent } from "@/lib/sync/derive";
import { parseTaskDefinition } from "@/lib/tasks";
import { deviceWorkload } from "./sync-workload";

const RUN = Number(process.env.SYNC_FOLD_RUN ?? 5_000);
const REPS = Number(process.env.SYNC_FOLD_REPS ?? 15);
const user = "00000000-0000-4000-8000-000000000001";

function runOf(perRun: number, batch: number) {
  const pushes = deviceWorkload(user, 1, perRun, batch);
  const est = [{ thetaMs: 120, deltaMs: 30, measuredAtWallMs: 1_767_000_000_000 }];
  const run = pushes[0]!.runs[0]!;
  const batches = pushes.map((p) =>
    p.events.map((e): DerivationEvent => {
      const c = correctStamp(e.stamp, est);
      return { id: e.id, deviceId: e.deviceId, seq: e.seq, recordedBy: user, body: e.body, stamp: { ...e.stamp, offset: e.stamp.offset ?? null }, correctedMs: c.correctedMs, uncertaintyMs: c.uncertaintyMs ?? Infinity };
    }),
  );
  const deviceId = pushes[0]!.deviceId;
  const facts = { task: parseTaskDefinition(run.task), createdBy: user, lanes: [{ lane: 0, pilotUserId: user }], officials: new Set<string>(), estimatesByDevice: new Map([[deviceId, est]]) };
  return { batches, facts };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
function time(label: string, f: () => void) {
  const ts: number[] = [];
  for (let i = 0; i < REPS; i++) {
    const t0 = performance.now();
    f();
    ts.push(performance.now() - t0);
  }
  console.log(`${label}: median ${median(ts).toFixed(2)} ms (min ${Math.min(...ts).toFixed(2)})`);
}

// (1) a new run of 100 events, derived in full and folded (storeDerivations' full path), twice per 200-item push
{
  const { batches, facts } = runOf(100, 1_000);
  const events = batches.flat().sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  time("full derivation + fold of a new 100-event run (x2 per throughput push)", () => {
    const input = { ...facts, events };
    const lanes = deriveRun(input);
    let fold: RunFold | null = buildFold(input);
    if (fold && JSON.stringify(lanesOfFold(fold, input)) !== JSON.stringify(lanes)) fold = null;
    JSON.stringify(fold);
    for (const d of lanes) JSON.stringify(d.derived);
  });
}

// (2) 200 events into a run of RUN
{
  const { batches, facts } = runOf(RUN + 200, 200);
  const last = batches.pop()!;
  const events = batches.flat().sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const fold = buildFold({ ...facts, events })!;
  const stored = JSON.stringify(fold);
  console.log(`(folded state of a ${events.length}-event run: ${(stored.length / 1024).toFixed(0)} kB of JSON)`);
  time(`resume: 200 events into a run of ${events.length} (parse state, resume, stringify state and lanes)`, () => {
    const state = JSON.parse(stored) as RunFold;
    const r = resumeFold(state, facts, last, events.length + last.length, true); // owned, as storeDerivations resumes it
    if (!r.ok) throw new Error(r.reason);
    JSON.stringify(r.fold);
    for (const d of r.lanes) JSON.stringify(d.derived);
  });
  time("  of which JSON.parse of the state", () => void JSON.parse(stored));
  time("  of which JSON.stringify of the state", () => void JSON.stringify(fold));
  time("  of which lanesOfFold", () => void lanesOfFold(fold, facts));
}
