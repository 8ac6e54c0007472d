/**
 * Runs `run` once the page has settled: after the window's `load` event, `delayMs` more, then the
 * browser's next idle period (at most `IDLE_TIMEOUT_MS` later). For work no screen needs to draw
 * or to take a tap, such as evaluating the sync runtime and its first pull (issue #10): done during
 * load it is the page's longest blocking task. Returns a function that cancels it if it has not run.
 */
export const SETTLE_DELAY_MS = 2_000;
const IDLE_TIMEOUT_MS = 1_000;

/** The parts of `window` used here (a fake in tests). */
export type SettleWindow = {
  document: { readyState: DocumentReadyState };
  addEventListener(type: "load", fn: () => void): void;
  removeEventListener(type: "load", fn: () => void): void;
  setTimeout(fn: () => void, ms: number): number;
  clearTimeout(id: number): void;
  requestIdleCallback?: (fn: () => void, options: { timeout: number }) => number;
  cancelIdleCallback?: (id: number) => void;
};

export function whenSettled(run: () => void, delayMs = SETTLE_DELAY_MS, win: SettleWindow = window): () => void {
  let cancelled = false;
  let timer: number | null = null;
  let idle: number | null = null;
  const onIdle = () => {
    idle = null;
    if (!cancelled) run();
  };
  const afterDelay = () => {
    timer = null;
    if (cancelled) return;
    if (win.requestIdleCallback) idle = win.requestIdleCallback(onIdle, { timeout: IDLE_TIMEOUT_MS });
    else timer = win.setTimeout(onIdle, 0);
  };
  const onLoad = () => {
    win.removeEventListener("load", onLoad);
    if (!cancelled) timer = win.setTimeout(afterDelay, delayMs);
  };
  if (win.document.readyState === "complete") onLoad();
  else win.addEventListener("load", onLoad);
  return () => {
    cancelled = true;
    win.removeEventListener("load", onLoad);
    if (timer !== null) win.clearTimeout(timer);
    if (idle !== null) win.cancelIdleCallback?.(idle);
  };
}
