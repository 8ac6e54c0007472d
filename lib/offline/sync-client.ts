import { boundAt, type ClockEstimate } from "@/lib/clock";
import { backoffDelay } from "./backoff";
import { measureClock } from "./clock-sync";
import { getMeta, type WindowcallDb } from "./db";
import { getDeviceId } from "./device";
import { describeFailure, type FetchLike } from "./http";
import { countUnsent, listRejected } from "./outbox";
import { pullAll } from "./pull";
import { pushOutbox } from "./push";
import type { FlushOutcome, PullResult, SyncClientOptions, SyncStatus, Timers } from "./sync-types";

export type { FlushOutcome, LocalFailure, PullResult, SyncClientOptions, SyncState, SyncStatus, Timers } from "./sync-types";

/**
 * The device side of sync (SYNC.md §2–4): flushes the outbox, pulls changes, measures the
 * clock offset, and reports its status. Everything it touches is injected, so it runs in
 * Node under test; the browser triggers live in `startSyncInBrowser` (sync-browser.ts).
 */

const defaultTimers: Timers = {
  set: (fn, ms) => setTimeout(fn, ms),
  clear: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
};

export class SyncClient {
  private readonly db: WindowcallDb;
  private readonly fetch: FetchLike;
  private readonly now: () => number;
  private readonly random: () => number;
  private readonly timers: Timers;
  private readonly baseUrl: string;
  private readonly debounceMs: number;
  private readonly clockMaxAgeMs: number;
  private readonly account: () => string | null;

  private current: Omit<SyncStatus, "offset"> = {
    unsent: 0, rejected: [], lastSyncAt: null, lastError: null, state: "idle", nextRetryAt: null, pulling: null,
  };
  private estimate: ClockEstimate | null = null;
  private listeners = new Set<(s: SyncStatus) => void>();
  private flushing: Promise<FlushOutcome> | null = null;
  private flushAgain = false;
  private pulling: Promise<PullResult> | null = null;
  private measuring: Promise<ClockEstimate | null> | null = null;
  private failures = 0;
  private retryTimer: unknown = null;
  private debounceTimer: unknown = null;
  private closed = false;

  constructor(options: SyncClientOptions) {
    this.db = options.db;
    // after close() no request leaves (an exchange already looping, a retry, an `online` event)
    this.fetch = (input, init) => (this.closed ? Promise.reject(new TypeError("sync client closed")) : options.fetch(input, init));
    const clock = options.clock ?? { now: () => Date.now() };
    this.now = () => clock.now();
    this.random = options.random ?? Math.random;
    this.timers = options.timers ?? defaultTimers;
    this.baseUrl = options.baseUrl ?? "";
    this.debounceMs = options.debounceMs ?? 500;
    this.clockMaxAgeMs = options.clockMaxAgeMs ?? 10 * 60_000;
    this.account = options.account ?? (() => null);
  }

  /** The latest status snapshot. */
  status(): SyncStatus {
    const offset = this.estimate
      ? { thetaMs: this.estimate.thetaMs, boundMs: boundAt(this.estimate, this.now()) }
      : null;
    return { ...this.current, offset };
  }

  /** Call `listener` on every status change; returns the unsubscribe function. */
  subscribe(listener: (s: SyncStatus) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** The offset estimate in use (null until one is measured or loaded). */
  currentEstimate(): ClockEstimate | null {
    return this.estimate;
  }

  /** Re-read the unsent count and the rejected list from the database. */
  async refreshStatus(): Promise<SyncStatus> {
    const [unsent, rejected] = await Promise.all([countUnsent(this.db), listRejected(this.db)]);
    this.update({ unsent, rejected });
    return this.status();
  }

  /**
   * Push the outbox. Single-flight: a call while a flush runs gets the same promise, and
   * that flush makes one more pass so writes made meanwhile are not left behind.
   */
  flush(): Promise<FlushOutcome> {
    if (this.flushing) {
      this.flushAgain = true;
      return this.flushing;
    }
    this.flushing = this.runFlush().finally(() => {
      this.flushing = null;
    });
    return this.flushing;
  }

  private async runFlush(): Promise<FlushOutcome> {
    this.update({ state: "syncing" });
    let outcome: FlushOutcome;
    try {
      const deviceId = await getDeviceId(this.db);
      do {
        this.flushAgain = false;
        outcome = await pushOutbox({ db: this.db, fetch: this.fetch, deviceId, baseUrl: this.baseUrl, account: this.account() });
      } while (this.flushAgain && outcome.kind === "ok");
    } catch (e) {
      outcome = { kind: "local", message: e instanceof Error ? e.message : String(e) };
    }
    await this.settle(outcome);
    return outcome;
  }

  /** Pull everything changed on the server into the local database. Single-flight. */
  pull(): Promise<PullResult> {
    this.pulling ??= this.runPull().finally(() => {
      this.pulling = null;
    });
    return this.pulling;
  }

  private async runPull(): Promise<PullResult> {
    this.update({ state: "syncing" });
    let outcome: PullResult;
    try {
      outcome = await pullAll({
        db: this.db, fetch: this.fetch, baseUrl: this.baseUrl, account: this.account(),
        onProgress: (pulling) => this.update({ pulling }),
      });
    } catch (e) {
      outcome = { kind: "local", message: e instanceof Error ? e.message : String(e) };
    }
    this.current.pulling = null;
    await this.settle(outcome);
    return outcome;
  }

  /** Push, then (if that worked) pull. */
  async sync(): Promise<void> {
    const pushed = await this.flush();
    if (pushed.kind === "ok") await this.pull();
  }

  /** One burst of clock exchanges; keeps and returns the new estimate (or null). Single-flight. */
  measureClock(): Promise<ClockEstimate | null> {
    this.measuring ??= measureClock({ db: this.db, fetch: this.fetch, now: this.now, baseUrl: this.baseUrl })
      .then((e) => {
        if (e) {
          this.estimate = e;
          this.emit();
        }
        return e;
      })
      .catch(() => null)
      .finally(() => {
        this.measuring = null;
      });
    return this.measuring;
  }

  /** A record was written locally: refresh the count and flush after a short quiet spell. */
  notifyWrite(): void {
    void this.refreshStatus().catch(() => undefined);
    if (this.debounceTimer !== null) this.timers.clear(this.debounceTimer);
    this.debounceTimer = this.timers.set(() => {
      this.debounceTimer = null;
      // while backing off, the scheduled retry will carry this write too
      if (this.current.state !== "signed-out" && this.retryTimer === null) void this.flush();
    }, this.debounceMs);
  }

  /** The network is back: forget the backoff, measure the clock (after an offline period) and sync. */
  onOnline(): void {
    if (this.current.state === "signed-out") return;
    this.clearRetry();
    this.failures = 0;
    void this.measureClock().then(() => this.sync());
  }

  /** The page became visible (maybe after a sleep): sync, re-measuring a stale clock estimate. */
  onVisible(): void {
    if (this.current.state === "signed-out") return;
    const stale = !this.estimate || this.now() - this.estimate.measuredAtWallMs > this.clockMaxAgeMs;
    if (stale) void this.measureClock();
    void this.sync();
  }

  /** Load the stored estimate and status, then measure the clock and sync. */
  async start(): Promise<void> {
    this.estimate = (await getMeta(this.db, "clockEstimate")) ?? null;
    await this.refreshStatus();
    await this.measureClock();
    await this.sync();
  }

  /** After signing in again: leave the signed-out state and sync. */
  async resume(): Promise<void> {
    this.failures = 0;
    this.update({ state: "idle", lastError: null });
    await this.sync();
  }

  /**
   * For good (sign-out): cancel pending timers and send nothing more, so no request carries the
   * old session once a sign-out began (a clock burst in progress stops at its next exchange).
   */
  close(): void {
    this.closed = true;
    this.stop();
  }

  /** Cancel pending timers (page teardown, tests). */
  stop(): void {
    this.clearRetry();
    if (this.debounceTimer !== null) this.timers.clear(this.debounceTimer);
    this.debounceTimer = null;
  }

  /** Record the outcome of a push or pull: state, error, backoff. */
  private async settle(outcome: FlushOutcome | PullResult): Promise<void> {
    const [unsent, rejected] = await Promise.all([countUnsent(this.db), listRejected(this.db)]).catch(
      () => [this.current.unsent, this.current.rejected] as const,
    );
    if (outcome.kind === "ok") {
      this.failures = 0;
      this.clearRetry();
      this.update({ unsent, rejected: [...rejected], state: "idle", lastError: null, lastSyncAt: this.now() });
      return;
    }
    if (outcome.kind === "signed-out") {
      this.clearRetry();
      this.update({ unsent, rejected: [...rejected], state: "signed-out", lastError: "signed out" });
      return;
    }
    const lastError = outcome.kind === "local" ? `on this device: ${outcome.message}` : describeFailure(outcome);
    this.failures += 1;
    const delay = backoffDelay(this.failures, this.random);
    this.clearRetry();
    this.retryTimer = this.timers.set(() => {
      this.retryTimer = null;
      this.update({ nextRetryAt: null });
      if (this.current.state !== "signed-out") void this.sync();
    }, delay);
    const state = outcome.kind === "network" ? "offline" : "idle";
    this.update({ unsent, rejected: [...rejected], state, lastError, nextRetryAt: this.now() + delay });
  }

  private clearRetry(): void {
    if (this.retryTimer !== null) this.timers.clear(this.retryTimer);
    this.retryTimer = null;
    this.current.nextRetryAt = null;
  }

  private update(patch: Partial<Omit<SyncStatus, "offset">>): void {
    this.current = { ...this.current, ...patch };
    this.emit();
  }

  private emit(): void {
    const s = this.status();
    for (const l of this.listeners) l(s);
  }
}

/** Create the device's sync client. */
export function createSyncClient(options: SyncClientOptions): SyncClient {
  return new SyncClient(options);
}
