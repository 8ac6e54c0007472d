import { estimateFromSamples, FILTER_SIZE, type ClockEstimate, type TimeSample } from "@/lib/clock";
import { clockEstimateSchema, timeReplySchema } from "@/lib/validations/sync";
import { getMeta, setMeta, type WindowcallDb } from "./db";
import { postJson, requestJson, type FetchLike } from "./http";

/** Exchanges per measurement burst. */
export const EXCHANGES_PER_BURST = 4;
/** Bursts kept in `clockSamples`: enough history to interpolate across several offline periods. */
export const BURSTS_KEPT = 32;

export type ClockDeps = { db: WindowcallDb; fetch: FetchLike; now: () => number; baseUrl?: string };

/**
 * One burst of /api/time exchanges (SYNC.md §4). T1 and T4 come from the device wall clock
 * (`now`). Each exchange is sent once: a failed one is dropped, never retried, and a
 * reply whose echoed T1 is not ours (a replayed or retried request) is not a sample.
 * Stores the burst's samples (at most 8) and, if one is usable, the new estimate.
 */
export async function measureClock(deps: ClockDeps, exchanges = EXCHANGES_PER_BURST): Promise<ClockEstimate | null> {
  const samples: TimeSample[] = [];
  for (let i = 0; i < exchanges; i++) {
    const t1 = deps.now();
    const r = await requestJson(deps.fetch, `${deps.baseUrl ?? ""}/api/time`, postJson({ t1 }), timeReplySchema);
    const t4 = deps.now();
    if (r.kind !== "ok" || r.value.t1 !== t1) continue;
    samples.push({ t1, t2: r.value.t2, t3: r.value.t3, t4 });
  }
  if (samples.length === 0) return null;
  const kept = samples.slice(-FILTER_SIZE);
  const estimate = usable(estimateFromSamples(kept));

  await deps.db.transaction("rw", [deps.db.clockSamples, deps.db.meta], async () => {
    const burstId = ((await getMeta(deps.db, "clockBurst")) ?? 0) + 1;
    await setMeta(deps.db, "clockBurst", burstId);
    await deps.db.clockSamples.bulkAdd(kept.map((s) => ({ ...s, burstId })));
    await deps.db.clockSamples.where("burstId").belowOrEqual(burstId - BURSTS_KEPT).delete();
    if (estimate) await setMeta(deps.db, "clockEstimate", estimate);
  });
  return estimate;
}

/** An estimate the protocol can carry (bounded θ and δ; clockEstimateSchema), else null. */
function usable(e: ClockEstimate | null): ClockEstimate | null {
  return e && clockEstimateSchema.safeParse(e).success ? e : null;
}

/** One estimate per stored burst, oldest first: the device's history for interpolation. */
export async function listClockEstimates(db: WindowcallDb): Promise<ClockEstimate[]> {
  const rows = await db.clockSamples.orderBy("burstId").toArray();
  const bursts = new Map<number, TimeSample[]>();
  for (const { burstId, t1, t2, t3, t4 } of rows) {
    const list = bursts.get(burstId) ?? [];
    list.push({ t1, t2, t3, t4 });
    bursts.set(burstId, list);
  }
  const out: ClockEstimate[] = [];
  for (const samples of bursts.values()) {
    const e = usable(estimateFromSamples(samples));
    if (e) out.push(e);
  }
  return out;
}
