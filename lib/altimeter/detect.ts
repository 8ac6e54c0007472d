import { fitLine, movingMedian, type Sample } from "./series";

/**
 * Launch detection in an altimeter trace (heights in metres, times in ms, sorted).
 *
 * A launch is a climb from near the ground to a peak within a few seconds:
 * 1. The heights are smoothed with a moving median over 0.3 s (noise, single spikes).
 * 2. A climb starts where the smoothed height leaves the local ground (the lowest smoothed height
 *    of the 3 s before) by more than ENTRY_M, and counts as a launch when it gains at least
 *    MIN_GAIN_M at an average of at least MIN_RATE_MS within MAX_CLIMB_S. The peak sample is the
 *    highest smoothed sample of that stretch. Ground level = the median of the raw samples of
 *    the 2 s before the climb that lie within 1 m of the local ground.
 * 3. Timing: the launch climb is taken as a ballistic zoom, the climb rate falling linearly to
 *    zero at the peak (h = H·(1 − ((t_p − t)/T)²)). Then √(1 − h/H) is a straight line in t: a
 *    least-squares line through the climb samples between 2 % and 98 % of the gain gives the
 *    instant it left the hand (where the line reaches 1) and the peak instant (where it reaches 0).
 * 4. Height: a straight line through the raw samples of the 3 s after the peak sample (the glide
 *    the model settles into), evaluated at the peak instant, minus the ground level.
 * 5. The trace is then skipped until the height is back within LANDED_M of the ground (a landing).
 *
 * Tolerances (tests/unit/altimeter/detect.test.ts, generated traces): each launch within 0.5 s
 * and 1 m for sampling 1–20 Hz, noise σ ≤ 0.15 m, climbs of 2.5–4 s to 15–90 m, glides sinking
 * ≤ 0.6 m/s. At 1 Hz a climb shorter than 2.5 s has fewer than two samples to time it by; it is
 * still found, timed by the first climbing sample (up to 1 s late).
 */
export type DetectedLaunch = { atMs: number; peakMs: number; heightM: number; groundM: number };

const ENTRY_M = 3;
const MIN_GAIN_M = 10;
const MIN_RATE_MS = 3;
const MAX_CLIMB_S = 6;
const LANDED_M = 2;

export function detectLaunches(samples: readonly Sample[]): DetectedLaunch[] {
  if (samples.length < 3) return [];
  const t = samples.map((s) => s.tMs);
  const raw = samples.map((s) => s.hM);
  const span = (t[t.length - 1]! - t[0]!) / (samples.length - 1) || 1000;
  const h = movingMedian(raw, Math.max(1, Math.round(300 / span)));
  const out: DetectedLaunch[] = [];
  let i = 1;
  while (i < samples.length) {
    const base = windowMin(h, t, i, 3000);
    if (h[i]! - base <= ENTRY_M) {
      i++;
      continue;
    }
    const start = lastNear(h, i, base, 1); // the last sample at ground level before the climb
    let peak = start;
    for (let j = start; j < samples.length && t[j]! - t[start]! <= MAX_CLIMB_S * 1000; j++) if (h[j]! > h[peak]!) peak = j;
    const gain = h[peak]! - base;
    const rate = gain / Math.max(0.001, (t[peak]! - t[start]!) / 1000);
    if (gain < MIN_GAIN_M || rate < MIN_RATE_MS) {
      i = skipToGround(h, peak + 1, base);
      continue;
    }
    const ground = groundLevel(raw, t, start, base);
    const launch = timeAndHeight(t, raw, start, peak, ground);
    out.push({ ...launch, groundM: ground });
    i = skipToGround(h, peak + 1, ground);
  }
  return out;
}

function windowMin(h: number[], t: number[], i: number, ms: number): number {
  let m = h[i - 1]!;
  for (let j = i - 1; j >= 0 && t[i]! - t[j]! <= ms; j--) m = Math.min(m, h[j]!);
  return m;
}

function lastNear(h: number[], i: number, base: number, tol: number): number {
  let j = i - 1;
  while (j > 0 && h[j]! - base > tol) j--;
  return j;
}

function skipToGround(h: number[], from: number, ground: number): number {
  let j = from;
  while (j < h.length && h[j]! - ground > LANDED_M) j++;
  return j;
}

function groundLevel(raw: number[], t: number[], start: number, base: number): number {
  const near: number[] = [];
  for (let j = start; j >= 0 && t[start]! - t[j]! <= 2000; j--) if (Math.abs(raw[j]! - base) <= 1) near.push(raw[j]!);
  if (near.length === 0) return base;
  near.sort((a, b) => a - b);
  return near[Math.floor(near.length / 2)]!;
}

function timeAndHeight(t: number[], raw: number[], start: number, peak: number, ground: number): Omit<DetectedLaunch, "groundM"> {
  const glide: Sample[] = [];
  for (let j = peak; j < raw.length && t[j]! - t[peak]! <= 3000; j++) glide.push({ tMs: t[j]!, hM: raw[j]! });
  const glideLine = glide.length >= 2 ? fitLine(glide) : null;
  const top = (ms: number) => (glideLine ? glideLine.at(ms) : raw[peak]!) - ground;
  // first pass with the peak sample's height, then once more with the height at the fitted peak
  let gainM = top(t[peak]!);
  let atMs = t[Math.min(start + 1, peak)]!;
  let peakMs = t[peak]!;
  for (let pass = 0; pass < 2; pass++) {
    const points: Sample[] = [];
    for (let j = start; j <= peak; j++) {
      const r = (raw[j]! - ground) / gainM;
      if (r > 0.02 && r < 0.98) points.push({ tMs: t[j]!, hM: Math.sqrt(1 - r) });
    }
    if (points.length < 2) break;
    const line = fitLine(points);
    if (line.slope >= 0) break;
    atMs = line.timeAt(1);
    peakMs = Math.max(line.timeAt(0), atMs);
    gainM = top(peakMs);
  }
  return { atMs: Math.round(atMs), peakMs: Math.round(peakMs), heightM: gainM };
}
