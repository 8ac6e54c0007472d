import type { OutboxKind, WindowcallDb } from "./db";
import type { FetchLike } from "./http";
import type { PullOutcome, PullProgress } from "./pull";
import type { PushOutcome } from "./push";

/** Types of the sync client's options and status (sync-client.ts). */

export type SyncState = "idle" | "syncing" | "offline" | "signed-out";

export type SyncStatus = {
  /** Items waiting to be sent (rejected ones excluded). */
  unsent: number;
  /** Items the server refused, kept on the device with the reason. */
  rejected: { id: string; kind: OutboxKind; reason: string }[];
  /** Device wall time of the last successful push or pull. */
  lastSyncAt: number | null;
  lastError: string | null;
  /** Current offset estimate and its bound now (δ/2 + drift since measured). */
  offset: { thetaMs: number; boundMs: number } | null;
  state: SyncState;
  /** When the next automatic retry is due after a failure. */
  nextRetryAt: number | null;
  /** While a pull runs: pages fetched so far and about how many in all (null before the first page). */
  pulling: PullProgress | null;
};

/** A failure inside the device (IndexedDB closed, quota...). */
export type LocalFailure = { kind: "local"; message: string };
export type FlushOutcome = PushOutcome | LocalFailure;
export type PullResult = PullOutcome | LocalFailure;

export type Timers = { set(fn: () => void, ms: number): unknown; clear(handle: unknown): void };

export type SyncClientOptions = {
  db: WindowcallDb;
  fetch: FetchLike;
  /** Device wall clock (T1/T4, timestamps). */
  clock?: { now(): number };
  random?: () => number;
  timers?: Timers;
  baseUrl?: string;
  /** Wait after a write before flushing, so a burst of taps goes in one push. */
  debounceMs?: number;
  /** Re-measure the clock on becoming visible when the estimate is older than this. */
  clockMaxAgeMs?: number;
  /**
   * The account whose device database this is, named in every push and pull so the server
   * refuses them under another account's session (a shared phone; device-user.ts).
   */
  account?: () => string | null;
};
