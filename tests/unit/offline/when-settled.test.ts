import { describe, expect, it } from "vitest";
import { whenSettled, type SettleWindow } from "@/components/sync/when-settled";

/** A window whose load event, timers and idle callbacks run only when the test says so. */
function fakeWindow(readyState: DocumentReadyState, idle = true) {
  const loads = new Set<() => void>();
  const timers = new Map<number, { fn: () => void; ms: number }>();
  const idles = new Map<number, () => void>();
  let next = 1;
  const win: SettleWindow = {
    document: { readyState },
    addEventListener: (_t, fn) => void loads.add(fn),
    removeEventListener: (_t, fn) => void loads.delete(fn),
    setTimeout: (fn, ms) => (timers.set(next, { fn, ms }), next++),
    clearTimeout: (id) => void timers.delete(id),
    ...(idle
      ? { requestIdleCallback: (fn: () => void) => (idles.set(next, fn), next++), cancelIdleCallback: (id: number) => void idles.delete(id) }
      : {}),
  };
  const drain = <T,>(m: Map<number, T>, call: (v: T) => void) => {
    const all = [...m.entries()];
    m.clear();
    for (const [, v] of all) call(v);
  };
  return {
    win,
    load: () => [...loads].forEach((fn) => fn()),
    timers: () => [...timers.values()].map((t) => t.ms),
    fireTimers: () => drain(timers, (t) => t.fn()),
    fireIdle: () => drain(idles, (fn) => fn()),
  };
}

describe("whenSettled (the sync runtime loads after the page's load, issue #10)", () => {
  it("waits for the load event, then the delay, then an idle period", () => {
    const w = fakeWindow("interactive");
    let ran = 0;
    whenSettled(() => ran++, 2_000, w.win);
    w.fireTimers();
    w.fireIdle();
    expect(ran).toBe(0); // not before the load event
    w.load();
    expect(w.timers()).toEqual([2_000]);
    w.fireIdle();
    expect(ran).toBe(0); // not before the delay
    w.fireTimers();
    expect(ran).toBe(0); // not before the browser is idle
    w.fireIdle();
    expect(ran).toBe(1);
  });

  it("starts the delay at once when the page has already loaded, and falls back to a timer without idle callbacks", () => {
    const w = fakeWindow("complete", false);
    let ran = 0;
    whenSettled(() => ran++, 500, w.win);
    expect(w.timers()).toEqual([500]);
    w.fireTimers();
    expect(ran).toBe(0);
    w.fireTimers();
    expect(ran).toBe(1);
  });

  it("runs nothing once cancelled, at any step", () => {
    for (const step of [0, 1, 2]) {
      const w = fakeWindow("loading");
      let ran = 0;
      const cancel = whenSettled(() => ran++, 100, w.win);
      if (step >= 1) w.load();
      if (step >= 2) w.fireTimers();
      cancel();
      w.load();
      w.fireTimers();
      w.fireIdle();
      expect(ran).toBe(0);
    }
  });
});
