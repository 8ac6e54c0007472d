"use client";

import { useCallback, useEffect, useState } from "react";

export type RunLog = {
  id: string;
  lane: number;
  fileName: string;
  loggerName: string;
  samples: number | null;
  launches: { atMs: number; heightM: number; flightIndex: number | null; gapMs: number | null }[];
};

/** The run's altimeter logs from the server (online only; a run the server does not know gives none). */
export function useLaunchHeights(runId: string | null): { logs: RunLog[]; reload: () => void } {
  const [logs, setLogs] = useState<RunLog[]>([]);
  const [tick, setTick] = useState(0);
  useEffect(() => {
    if (!runId) return;
    let live = true;
    fetch(`/api/runs/${runId}/logs`, { cache: "no-store" })
      .then((r) => (r.ok ? (r.json() as Promise<{ logs: RunLog[] }>) : { logs: [] }))
      .then((d) => live && setLogs(d.logs))
      .catch(() => undefined); // offline: the heights come back with the signal
    return () => {
      live = false;
    };
  }, [runId, tick]);
  const reload = useCallback(() => setTick((t) => t + 1), []);
  return { logs, reload };
}

/** Heights by flight index for one lane (the latest log wins where two logs name the same flight). */
export function heightsForLane(logs: readonly RunLog[], lane: number): Map<number, number> {
  const out = new Map<number, number>();
  for (const log of logs.filter((l) => l.lane === lane)) for (const x of log.launches) if (x.flightIndex !== null) out.set(x.flightIndex, x.heightM);
  return out;
}
