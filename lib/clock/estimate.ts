import type { ClockEstimate } from "./drift";
import { chooseSample, sampleDelay, sampleOffset, type TimeSample } from "./offset";

/**
 * The ClockEstimate of a burst of exchanges: the clock-filter choice (see `chooseSample`),
 * stamped with the device wall time its reply arrived (T4). Null when no sample is usable.
 */
export function estimateFromSamples(samples: readonly TimeSample[]): ClockEstimate | null {
  const chosen = chooseSample(samples);
  if (chosen === null) return null;
  return {
    thetaMs: sampleOffset(chosen.sample),
    deltaMs: sampleDelay(chosen.sample),
    measuredAtWallMs: chosen.sample.t4,
  };
}
