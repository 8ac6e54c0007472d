/**
 * A model's record, from the lanes it flew in: which flights it flew (the lane's latest "model"
 * event at or before each launch), their launch heights, times per task, turnaround (landing to
 * the next launch in the same lane, both with this model: the Season's ground time) and when it last flew.
 */
export type ModelLane = {
  taskCode: string;
  /** The lane's flights on the corrected clock, like the choices (lib/results/flight-instants.ts). */
  flights: { index: number; launchAtMs: number; landAtMs: number | null; timeTenths: number }[];
  /** The lane's model choices on the corrected clock. */
  choices: { atMs: number; modelId: string }[];
  /** Launch heights by flight index. */
  heights: Map<number, number>;
  /**
   * The turnaround before each flight (by flight index), in ms: the ground time since the lane's
   * previous landing as the Season counts it (db/queries/season/turnaround.ts); absent when none counts.
   */
  groundMs: Map<number, number>;
};

export type ModelStats = {
  flights: number;
  launches: number;
  medianLaunchM: number | null;
  bestLaunchM: number | null;
  medianTimeByTask: { taskCode: string; medianTenths: number; flights: number }[];
  medianTurnaroundMs: number | null;
  lastFlownMs: number | null;
};

export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/** The model flying at this instant: the latest choice at or before it (of equal instants, the last listed). Mirrored in SQL by db/queries/flight-model.ts. */
export function modelAt(choices: readonly { atMs: number; modelId: string }[], atMs: number): string | null {
  let best: { atMs: number; modelId: string } | null = null;
  for (const c of choices) if (c.atMs <= atMs && (!best || c.atMs >= best.atMs)) best = c;
  return best?.modelId ?? null;
}

export function modelStats(modelId: string, lanes: readonly ModelLane[]): ModelStats {
  const heights: number[] = [];
  const byTask = new Map<string, number[]>();
  const turnarounds: number[] = [];
  let flights = 0;
  let lastFlownMs: number | null = null;
  for (const lane of lanes) {
    const sorted = [...lane.flights].sort((a, b) => a.launchAtMs - b.launchAtMs);
    sorted.forEach((f, i) => {
      if (modelAt(lane.choices, f.launchAtMs) !== modelId) return;
      flights++;
      lastFlownMs = Math.max(lastFlownMs ?? 0, f.landAtMs ?? f.launchAtMs);
      byTask.set(lane.taskCode, [...(byTask.get(lane.taskCode) ?? []), f.timeTenths]);
      const h = lane.heights.get(f.index);
      if (h !== undefined) heights.push(h);
      const next = sorted[i + 1];
      // the ground time between two flights of this model, the one the Season reads (never worked out again here)
      const ground = next && modelAt(lane.choices, next.launchAtMs) === modelId ? lane.groundMs.get(next.index) : undefined;
      if (ground !== undefined) turnarounds.push(ground);
    });
  }
  return {
    flights,
    launches: heights.length,
    medianLaunchM: median(heights),
    bestLaunchM: heights.length ? Math.max(...heights) : null,
    medianTimeByTask: [...byTask].map(([taskCode, t]) => ({ taskCode, medianTenths: median(t)!, flights: t.length })).sort((a, b) => a.taskCode.localeCompare(b.taskCode)),
    medianTurnaroundMs: median(turnarounds),
    lastFlownMs,
  };
}
