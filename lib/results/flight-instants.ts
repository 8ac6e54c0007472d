import type { LaneDerived } from "./types";

/** A derived flight on the run's corrected clock (epoch ms), for matching logs and model choices. */
export type FlightInstant = { index: number; launchAtMs: number; landAtMs: number | null; timeTenths: number };

type Stored = { flights?: Partial<LaneDerived["flights"][number]>[]; versions?: Partial<LaneDerived["versions"][number]>[] } | null | undefined;

/**
 * The flights of a lane's stored derivation (run_lanes.derived) with their instants on the
 * corrected clock. `launchMs`/`landMs` there run from the working-time signal (task C: from the
 * attempt's signal), so they cannot be compared with a log or a "model" event. Lanes derived
 * before the flights carried `launchAtMs` take it from the chosen version's flights, which list
 * the same flights in the same order; a flight with neither is left out rather than guessed.
 */
export function flightInstants(derived: unknown): FlightInstant[] {
  const d = derived as Stored;
  const chosen = d?.versions?.find((v) => v.chosen)?.flights ?? [];
  const out: FlightInstant[] = [];
  (d?.flights ?? []).forEach((f, i) => {
    const launchAtMs = f.launchAtMs ?? chosen[i]?.launchAtMs;
    if (typeof f.index !== "number" || typeof launchAtMs !== "number") return;
    const landAtMs = f.landAtMs !== undefined ? f.landAtMs : (chosen[i]?.landAtMs ?? null);
    out.push({ index: f.index, launchAtMs, landAtMs, timeTenths: f.timeTenths ?? 0 });
  });
  return out;
}
