/**
 * The field timer's clocks, injected so tests can drive them. In the browser: `Date.now()`
 * (wall, survives reloads and sleeps) and `performance.now()` (monotonic, exact inside one
 * page lifetime). Playwright's clock API fakes both, so e2e tests use the default.
 */
export type TimeSource = {
  /** Device wall clock, ms since the Unix epoch. */
  wallNow(): number;
  /** Monotonic ms since this page's time origin (the clock `event.timeStamp` uses). */
  monoNow(): number;
};

/** The browser's clocks; read lazily so the module is safe to import during server rendering. */
export const browserTimeSource: TimeSource = {
  wallNow: () => Date.now(),
  monoNow: () => performance.now(),
};

/** A clock a test moves by hand: `advance(ms)` moves wall and monotonic time together. */
export function manualTimeSource(startWallMs: number, startMonoMs = 0): TimeSource & { advance(ms: number): void } {
  let wall = startWallMs;
  let mono = startMonoMs;
  return {
    wallNow: () => wall,
    monoNow: () => mono,
    advance(ms: number) {
      wall += ms;
      mono += ms;
    },
  };
}
