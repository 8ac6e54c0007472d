import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { DEFAULT_PUSH_GATE_POLICY, PushGate, type PushGatePolicy } from "@/lib/sync/push-gate";

// The push gate (lib/sync/push-gate.ts) on fake timers: `work` resolves after `ms` of fake time and logs its start and end.
const POLICY: PushGatePolicy = { bulkItems: 100, quietMs: 100, restFactor: 3, maxWaitMs: 2_000, pollMs: 10 };
const clock = { now: () => Date.now(), sleep: (ms: number) => new Promise<void>((r) => setTimeout(r, ms)) };

let log: string[];
const work = (name: string, ms: number, fail = false) => async () => {
  log.push(`${name}+${Date.now()}`);
  await new Promise((r) => setTimeout(r, ms));
  log.push(`${name}-${Date.now()}`);
  if (fail) throw new Error(`${name} failed`);
  return name;
};
const gate = (p: Partial<PushGatePolicy> = {}) => new PushGate({ ...POLICY, ...p }, clock);

beforeEach(() => {
  vi.useFakeTimers({ now: 0 });
  log = [];
});
afterEach(() => vi.useRealTimers());

describe("push gate", () => {
  it("by default counts the crowd's pushes (10 items) and a phone's whole short run (52) as small, the outbox's batches (200) as bulk", async () => {
    const g = new PushGate(DEFAULT_PUSH_GATE_POLICY, clock);
    const all = Promise.all([g.run(10, work("s10", 10)), g.run(52, work("s52", 10)), g.run(200, work("b200", 10))]);
    await vi.advanceTimersByTimeAsync(100);
    await all;
    expect(g.stats()).toMatchObject({ smallPushes: 2, bulkPushes: 1 });
  });

  it("runs a bulk push at once when no small push is around, and back-to-back bulk pushes without a pause", async () => {
    const g = gate();
    const first = g.run(200, work("b1", 300));
    await vi.advanceTimersByTimeAsync(300);
    await expect(first).resolves.toBe("b1");
    const second = g.run(200, work("b2", 300));
    await vi.advanceTimersByTimeAsync(300);
    await expect(second).resolves.toBe("b2");
    expect(log).toEqual(["b1+0", "b1-300", "b2+300", "b2-600"]);
    expect(g.stats()).toMatchObject({ bulkPushes: 2, waitedMs: 0 });
  });

  it("never delays a small push, even while a bulk push runs or waits", async () => {
    const g = gate();
    void g.run(200, work("b1", 300));
    await vi.advanceTimersByTimeAsync(100);
    void g.run(10, work("s1", 300)); // during b1
    void g.run(200, work("b2", 300)); // waits for b1, then for s1 (ends at 400) and the quiet window
    await vi.advanceTimersByTimeAsync(250);
    void g.run(52, work("s2", 50)); // while b2 waits: 52 items is still small
    await vi.advanceTimersByTimeAsync(2_000);
    expect(log).toContain("s1+100");
    expect(log).toContain("s2+350");
    expect(log).toContain("b2+500");
  });

  it("makes a bulk push wait while small pushes are in flight and until they are quiet, then runs it", async () => {
    const g = gate();
    void g.run(200, work("b1", 300)); // sets the previous bulk time: 300 ms, so at most 900 ms of rest
    await vi.advanceTimersByTimeAsync(300);
    void g.run(10, work("s1", 200));
    void g.run(200, work("b2", 100));
    await vi.advanceTimersByTimeAsync(1_000);
    // s1 ends at 500; quiet 100 ms later
    expect(log).toEqual(["b1+0", "b1-300", "s1+300", "s1-500", "b2+600", "b2-700"]);
    expect(g.stats().waitedMs).toBe(300);
  });

  it("bounds a bulk push's wait (restFactor × the previous bulk push, at most maxWaitMs): never starved by a stream of small pushes", async () => {
    const g = gate();
    void g.run(200, work("b1", 300));
    await vi.advanceTimersByTimeAsync(300);
    const stream = (async () => {
      for (let i = 0; i < 100; i++) await g.run(10, work(`s${i}`, 20)); // small pushes back to back for 2 s
    })();
    void g.run(200, work("b2", 1_000));
    void g.run(200, work("b3", 100));
    await vi.advanceTimersByTimeAsync(5_000);
    await stream;
    expect(log).toContain("b2+1200"); // 3 × 300 ms of rest
    expect(log).toContain("b3+2400"); // b2 ended at 2200, the stream at 2300: quiet from 2400
    expect(g.stats().longestWaitMs).toBe(900);
  });

  it("caps any wait at maxWaitMs", async () => {
    const g = gate({ maxWaitMs: 500 });
    void g.run(200, work("b1", 1_000));
    await vi.advanceTimersByTimeAsync(1_000);
    void (async () => {
      for (let i = 0; i < 100; i++) await g.run(10, work(`s${i}`, 20));
    })();
    void g.run(200, work("b2", 10));
    await vi.advanceTimersByTimeAsync(3_000);
    expect(log).toContain("b2+1500");
  });

  it("runs bulk pushes one at a time, in arrival order", async () => {
    const g = gate();
    const all = Promise.all([g.run(200, work("b1", 100)), g.run(150, work("b2", 100)), g.run(100, work("b3", 100))]);
    await vi.advanceTimersByTimeAsync(300);
    await expect(all).resolves.toEqual(["b1", "b2", "b3"]);
    expect(log).toEqual(["b1+0", "b1-100", "b2+100", "b2-200", "b3+200", "b3-300"]);
  });

  it("releases the gate when a push fails: the next bulk push runs, and a failed small push no longer counts as in flight", async () => {
    const g = gate();
    const failedBulk = g.run(200, work("b1", 100, true));
    const next = g.run(200, work("b2", 100));
    const failedSmall = g.run(10, work("s1", 50, true));
    await Promise.all([expect(failedBulk).rejects.toThrow("b1 failed"), expect(failedSmall).rejects.toThrow("s1 failed"), vi.advanceTimersByTimeAsync(1_000)]);
    await expect(next).resolves.toBe("b2");
    // s1 failed at 50; b2's turn at 100 (b1 failed): 50 ms after s1, it waits for the quiet window only (until 150)
    expect(log).toEqual(["s1+0", "b1+0", "s1-50", "b1-100", "b2+150", "b2-250"]);
  });
});
