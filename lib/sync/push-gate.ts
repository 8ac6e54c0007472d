/**
 * Precedence for small pushes over bulk uploads inside one server process (issue #11: one account
 * uploading a long run must not slow other accounts' pushes). Pure: no framework or database; the
 * caller (db/queries/sync-push.ts applyPush) passes every push through `run` BEFORE it opens its
 * transaction, so nothing waits here while holding a pool connection or a lock.
 *
 * - A push of fewer than `bulkItems` items is small (a timekeeper's live taps, a phone's few new
 *   events, a whole short run sent at once): it runs at once, never delayed.
 * - A bulk push (a long run's batches of 200) runs one at a time per gate, in arrival order. When no
 *   small push is around (none in flight, none started or finished within `quietMs`) it runs at once:
 *   a bulk upload alone is not slowed at all. Otherwise it waits until small pushes are quiet, but at
 *   most `restFactor` × the previous bulk push's run time (a duty cycle: under a steady stream of small
 *   pushes bulk work takes at most 1 / (1 + restFactor) of the time) and never more than `maxWaitMs`,
 *   so a bulk upload is never starved.
 */

export type PushGatePolicy = {
  /** A push of at least this many items (sessions + runs + events + discards) is bulk. */
  bulkItems: number;
  /** Small pushes count as "around" while in flight and this long after one started or finished. */
  quietMs: number;
  /** While small pushes are around, a bulk push rests up to this many times the previous bulk push's run time. */
  restFactor: number;
  /** The longest any bulk push waits for small pushes (its wait for an earlier bulk push aside). */
  maxWaitMs: number;
  /** How often a waiting bulk push looks again while small pushes are in flight. */
  pollMs: number;
};

/**
 * 100 items: a live timekeeper's push carries a handful, the crowd measure's pushes 10, a phone that
 * sends a whole 50-event run at once ~52; the outbox's full batches (PUSH_BATCH_SIZE) are 200. Rest
 * factor, quiet window and bound chosen by bench/sync-big-run.ts (DEVELOPERS.md "Small pushes first").
 */
export const DEFAULT_PUSH_GATE_POLICY: PushGatePolicy = { bulkItems: 100, quietMs: 100, restFactor: 3, maxWaitMs: 2_000, pollMs: 10 };

export type GateClock = { now(): number; sleep(ms: number): Promise<void> };

const realClock: GateClock = { now: () => Date.now(), sleep: (ms) => new Promise((r) => setTimeout(r, ms)) };

/** What bulk pushes waited for (the bench prints it). */
export type PushGateStats = { bulkPushes: number; smallPushes: number; waitedMs: number; longestWaitMs: number };

export class PushGate {
  private smallInFlight = 0;
  private lastSmallAt = -Infinity;
  private lastBulkMs = 0;
  private turn: Promise<void> = Promise.resolve();
  private counts: PushGateStats = { bulkPushes: 0, smallPushes: 0, waitedMs: 0, longestWaitMs: 0 };

  constructor(
    readonly policy: PushGatePolicy = DEFAULT_PUSH_GATE_POLICY,
    private readonly clock: GateClock = realClock,
  ) {}

  /** Runs `work` (one push of `items` items) when its precedence allows; its result or error is passed on. */
  run<T>(items: number, work: () => Promise<T>): Promise<T> {
    return items >= this.policy.bulkItems ? this.bulk(work) : this.small(work);
  }

  stats(): PushGateStats {
    return { ...this.counts };
  }

  private async small<T>(work: () => Promise<T>): Promise<T> {
    this.counts.smallPushes += 1;
    this.smallInFlight += 1;
    this.lastSmallAt = this.clock.now();
    try {
      return await work();
    } finally {
      this.smallInFlight -= 1;
      this.lastSmallAt = this.clock.now();
    }
  }

  private async bulk<T>(work: () => Promise<T>): Promise<T> {
    const before = this.turn;
    let release!: () => void;
    this.turn = new Promise<void>((r) => (release = r));
    try {
      await before; // one bulk push at a time, in arrival order
      this.counts.bulkPushes += 1;
      const start = this.clock.now();
      const until = start + Math.min(this.policy.maxWaitMs, this.policy.restFactor * this.lastBulkMs);
      for (let now = start; this.smallAround(now) && now < until; now = this.clock.now()) {
        const quietAt = this.smallInFlight > 0 ? now + this.policy.pollMs : this.lastSmallAt + this.policy.quietMs;
        await this.clock.sleep(Math.max(1, Math.min(until, quietAt) - now));
      }
      const ran = this.clock.now();
      const waited = ran - start;
      this.counts.waitedMs += waited;
      this.counts.longestWaitMs = Math.max(this.counts.longestWaitMs, waited);
      try {
        return await work();
      } finally {
        this.lastBulkMs = this.clock.now() - ran;
      }
    } finally {
      release();
    }
  }

  private smallAround(now: number): boolean {
    return this.smallInFlight > 0 || now - this.lastSmallAt < this.policy.quietMs;
  }
}

/** The server process's gate: every push of this process goes through it (several processes each have their own). */
export const pushGate = new PushGate();
