/**
 * NTP-style offset estimation (RFC 5905 §8 on-wire formulas, §10 clock filter).
 *
 * T1 = device send, T2 = server receive, T3 = server send, T4 = device receive,
 * all in ms. T1/T4 are on the device's wall clock, T2/T3 on the server's.
 * Offset θ is "server time − device time".
 */

/** One request/reply exchange with the server. */
export type TimeSample = { t1: number; t2: number; t3: number; t4: number };

/** What `estimateOffset` reports: the chosen sample's θ and δ, and the asymmetry bound δ/2. */
export type OffsetEstimate = { offsetMs: number; delayMs: number; boundMs: number };

/** The RFC 5905 §10 clock filter looks at the 8 most recent samples. */
export const FILTER_SIZE = 8;

/** θ of one exchange: ((T2 − T1) + (T3 − T4)) / 2 (RFC 5905 §8). */
export function sampleOffset(s: TimeSample): number {
  return (s.t2 - s.t1 + (s.t3 - s.t4)) / 2;
}

/** δ of one exchange: (T4 − T1) − (T3 − T2) (RFC 5905 §8). */
export function sampleDelay(s: TimeSample): number {
  return s.t4 - s.t1 - (s.t3 - s.t2);
}

function assertFinite(s: TimeSample, index: number): void {
  for (const key of ["t1", "t2", "t3", "t4"] as const) {
    if (typeof s[key] !== "number" || !Number.isFinite(s[key])) {
      throw new RangeError(`estimateOffset: sample ${index} has a non-finite ${key}`);
    }
  }
}

/**
 * The clock filter: of the last 8 samples, the one with the smallest δ (ties go to the
 * most recent, which has drifted least). Samples with δ < 0 are skipped — a negative
 * round trip is physically impossible and means a clock was stepped mid-exchange.
 * Returns the chosen sample and its position in `samples`, or null if none is usable.
 * Throws RangeError on a non-finite time (malformed input, never silently skipped).
 */
export function chooseSample(samples: readonly TimeSample[]): { sample: TimeSample; index: number } | null {
  const start = Math.max(0, samples.length - FILTER_SIZE);
  let best: { sample: TimeSample; index: number; delay: number } | null = null;
  for (let i = start; i < samples.length; i++) {
    const s = samples[i]!;
    assertFinite(s, i);
    const delay = sampleDelay(s);
    if (delay < 0) continue;
    if (best === null || delay <= best.delay) best = { sample: s, index: i, delay };
  }
  return best && { sample: best.sample, index: best.index };
}

/**
 * Offset estimate from request/reply exchanges, oldest first (RFC 5905 §8 and §10).
 * Only the last 8 samples are considered; the one with the smallest delay is chosen.
 * Returns its θ (`offsetMs`), δ (`delayMs`) and the asymmetry bound δ/2 (`boundMs`).
 * Throws on empty input, on a non-finite time, and when every considered sample has
 * a negative delay.
 */
export function estimateOffset(samples: readonly TimeSample[]): OffsetEstimate {
  if (!Array.isArray(samples) || samples.length === 0) {
    throw new RangeError("estimateOffset: at least one sample is required");
  }
  const chosen = chooseSample(samples);
  if (chosen === null) {
    throw new RangeError("estimateOffset: every sample among the last 8 has a negative delay");
  }
  const delayMs = sampleDelay(chosen.sample);
  return { offsetMs: sampleOffset(chosen.sample), delayMs, boundMs: delayMs / 2 };
}
