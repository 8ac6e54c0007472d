/**
 * From a run's events to its results: one pure path for the field screen, the logbook, the
 * run page, the server's derivation and (later) contest results.
 */
export { runResult, type RunResult } from "./run-result";
export { placeEvents, placeStamp, type ClockStep, type Estimates, type PlacedEvent, type RecordedEvent } from "./place";
export { describeClockFlags } from "./clock-flags";
export { wasStarted } from "./started";
export type * from "./types";
export { setAsidePenalties, type SetAsidePenalty } from "./set-aside";
