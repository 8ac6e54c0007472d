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
  /**
   * Whether input events' `timeStamp` is on `monoNow`'s clock. Browsers stamp events with
   * their own native monotonic clock, so this holds only while `performance.now` is the
   * native one — not under a test harness's fake clock, where the handler's "now" is used.
   */
  inputsOnMonoClock(): boolean;
};

/** True when `performance.now` is the browser's own function (not replaced by a fake). */
export function isNativePerformanceNow(): boolean {
  const now = globalThis.performance?.now;
  return typeof now === "function" && /\[native code\]/.test(Function.prototype.toString.call(now));
}

/** The browser's clocks; read lazily so the module is safe to import during server rendering. */
export const browserTimeSource: TimeSource = {
  wallNow: () => Date.now(),
  monoNow: () => performance.now(),
  inputsOnMonoClock: isNativePerformanceNow,
};

/**
 * A clock a test moves by hand: `advance(ms)` moves wall and monotonic time together.
 * Input timestamps count as on its clock only if the test says so.
 */
export function manualTimeSource(startWallMs: number, startMonoMs = 0, inputsOnMonoClock = false): TimeSource & { advance(ms: number): void } {
  let wall = startWallMs;
  let mono = startMonoMs;
  return {
    wallNow: () => wall,
    monoNow: () => mono,
    inputsOnMonoClock: () => inputsOnMonoClock,
    advance(ms: number) {
      wall += ms;
      mono += ms;
    },
  };
}
