/**
 * Device clock offsets (SYNC.md §4, RFC 5905 §8–10). Pure: no browser APIs, no framework,
 * the same code on the phone and on the server.
 */
export {
  estimateOffset,
  chooseSample,
  sampleOffset,
  sampleDelay,
  FILTER_SIZE,
  type TimeSample,
  type OffsetEstimate,
} from "./offset";
export { DRIFT_RATE, driftMs, boundAt, storedOffset, type ClockEstimate } from "./drift";
export { interpolateOffset, holdOffset, offsetAt, type OffsetAt } from "./interpolate";
export {
  correctTime,
  elapsedBetween,
  judgeBoundary,
  SLEEP_TOLERANCE_MS,
  type DeviceStamp,
  type CorrectedTime,
  type Elapsed,
  type BoundaryVerdict,
} from "./correct";
export { estimateFromSamples } from "./estimate";
export { pruneEstimates, MAX_ESTIMATES_PER_DEVICE } from "./prune";
