import { msToTenths, type FlightStatus, type LiveFlight, type TaskDefinition } from "@/lib/tasks";

/**
 * Where things go on the working-time strip, in strip milliseconds (0 = working-time start;
 * task C: the attempts side by side, each from its signal to its landing deadline). Pure,
 * so the picture and its text equivalent come from the same numbers.
 */
export type StripSegment = { flight: number; fromMs: number; toMs: number; status: FlightStatus; airTenths: number };
export type StripTick = { flight: number; atMs: number; targetSec: number };
export type StripGap = { beforeFlight: number; fromMs: number; toMs: number; tenths: number };
export type StripBand = { label: string; fromMs: number; toMs: number };
export type StripLayout = {
  fromMs: number;
  toMs: number;
  /** Working time (one band; task C: one per attempt). */
  working: StripBand[];
  /** Landing windows after the working time (task C: the last 30 s before each deadline). */
  landing: StripBand[];
  segments: StripSegment[];
  ticks: StripTick[];
  /** Time on the ground inside the working time between landings and the next launch. */
  gaps: StripGap[];
  /** Minute marks of the scale, with their labels. */
  scale: { atMs: number; label: string }[];
};

const ATTEMPT_GAP_MS = 20_000; // blank space between task C attempts

/**
 * Lays out a lane's flights. `nowMs` (ms from the start, live screens only) closes a flight
 * still in the air at "now".
 */
export function stripLayout(def: TaskDefinition, flights: readonly LiveFlight[], nowMs: number | null = null): StripLayout {
  const block = def.kind === "all-up" ? def.landingDeadlineSec * 1000 : def.workingTimeSec * 1000;
  const offsetOf = (f: LiveFlight) => (def.kind === "all-up" ? (f.attempt ?? 0) * (block + ATTEMPT_GAP_MS) : 0);
  const working: StripBand[] = [];
  const landing: StripBand[] = [];
  const scale: { atMs: number; label: string }[] = [];
  if (def.kind === "all-up") {
    for (let a = 0; a < def.attempts; a++) {
      const at = a * (block + ATTEMPT_GAP_MS);
      const opens = def.launchWindowMs + def.capSec * 1000;
      working.push({ label: `Attempt ${a + 1}`, fromMs: at, toMs: at + block });
      if (opens < block) landing.push({ label: "landing window", fromMs: at + opens, toMs: at + block });
      for (let m = 0; m * 60_000 <= block; m++) scale.push({ atMs: at + m * 60_000, label: m === 0 ? `#${a + 1}` : String(m) });
    }
  } else {
    working.push({ label: "Working time", fromMs: 0, toMs: block });
    if (def.landingWindowSec > 0) landing.push({ label: "landing window", fromMs: block, toMs: block + def.landingWindowSec * 1000 });
    const minutes = def.workingTimeSec / 60;
    const step = minutes > 12 ? 5 : 1;
    for (let m = 0; m <= minutes; m += step) scale.push({ atMs: m * 60_000, label: String(m) });
  }

  const segments: StripSegment[] = [];
  const ticks: StripTick[] = [];
  for (const f of flights) {
    const end = f.landMs ?? nowMs;
    if (end === null) continue; // never landed and not live: nothing to draw but the row in the table
    const o = offsetOf(f);
    segments.push({ flight: f.index, fromMs: o + f.launchMs, toMs: o + Math.max(end, f.launchMs), status: f.status, airTenths: f.landMs !== null && f.airTenths !== null ? f.airTenths : msToTenths(end - f.launchMs) });
    if (f.targetSec !== null) ticks.push({ flight: f.index, atMs: o + f.launchMs + f.targetSec * 1000, targetSec: f.targetSec });
  }

  const gaps: StripGap[] = [];
  if (def.kind !== "all-up") {
    let groundFrom = 0;
    for (const s of [...segments].sort((a, b) => a.fromMs - b.fromMs)) {
      const from = Math.max(0, groundFrom);
      const to = Math.min(block, s.fromMs);
      if (to > from) gaps.push({ beforeFlight: s.flight, fromMs: from, toMs: to, tenths: msToTenths(to - from) });
      groundFrom = Math.max(groundFrom, s.toMs);
    }
  }

  const last = [...working, ...landing].reduce((m, b) => Math.max(m, b.toMs), 0);
  const first = Math.min(0, ...segments.map((s) => s.fromMs));
  const latest = Math.max(last, ...segments.map((s) => s.toMs));
  // A target the flight never came near and that lies past the strip is left out, not drawn off the edge.
  const shown = ticks.filter((t) => t.atMs <= latest);
  return { fromMs: first, toMs: latest, working, landing, segments, ticks: shown, gaps, scale };
}
