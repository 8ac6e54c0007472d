import type { TaskDefinition } from "./definition";

export type Phase = "not-started" | "working" | "landing-window" | "ended";

/** The run's clock at `nowMs`: phase, time left, and whether a launch now may count. */
export type RunClock = {
  phase: Phase;
  elapsedMs: number | null;
  workingTimeLeftMs: number | null;
  landingWindowLeftMs: number | null;
  attempt: { index: number; of: number } | null;
  /** Time still counted for a flight in the air or launched now. */
  flyLeftMs: number;
  launchOpen: boolean;
};

/** Works out the phase of the run at `nowMs`. */
export function phaseOf(def: TaskDefinition, signalsMs: readonly number[], nowMs: number): RunClock {
  if (def.kind === "all-up") {
    const given = signalsMs.slice(0, def.attempts);
    const index = given.length - 1;
    const signal = given[index];
    if (signal === undefined || nowMs < signal) {
      return { phase: "not-started", elapsedMs: null, workingTimeLeftMs: null, landingWindowLeftMs: null, attempt: null, flyLeftMs: def.capSec * 1000, launchOpen: false };
    }
    const deadline = signal + def.landingDeadlineSec * 1000;
    const attempt = { index, of: def.attempts };
    const phase: Phase = nowMs <= deadline ? "working" : "ended";
    const launchOpen = nowMs - signal <= def.launchWindowMs;
    return { phase, elapsedMs: nowMs - signal, workingTimeLeftMs: Math.max(0, deadline - nowMs), landingWindowLeftMs: null, attempt, flyLeftMs: Math.max(0, deadline - nowMs), launchOpen };
  }
  const start = signalsMs[0];
  const wtMs = def.workingTimeSec * 1000;
  if (start === undefined || nowMs < start) {
    return { phase: "not-started", elapsedMs: null, workingTimeLeftMs: null, landingWindowLeftMs: null, attempt: null, flyLeftMs: wtMs, launchOpen: false };
  }
  const end = start + wtMs;
  const landingEnd = end + def.landingWindowSec * 1000;
  const phase: Phase = nowMs < end ? "working" : nowMs <= landingEnd ? "landing-window" : "ended";
  return {
    phase,
    elapsedMs: nowMs - start,
    workingTimeLeftMs: Math.max(0, end - nowMs),
    landingWindowLeftMs: phase === "landing-window" ? landingEnd - nowMs : null,
    attempt: null,
    flyLeftMs: Math.max(0, end - nowMs),
    launchOpen: nowMs < end,
  };
}
