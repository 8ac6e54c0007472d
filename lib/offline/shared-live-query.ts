import { liveQuery, type Subscription } from "dexie";

/**
 * One Dexie live query shared by every component that shows its answer. `useLiveQuery` runs
 * its query once per component, and again in each of them after every write to what it read:
 * two components of one page reading the same rows did the work twice, on the main thread,
 * while the page loads (issue #10, /field). Here the query runs once per change however many
 * listen; it starts with the first listener and stops with the last (the next one starts it
 * afresh, on the database then in use). Shaped for React's `useSyncExternalStore`.
 */
export type SharedLiveQuery<T> = {
  subscribe(listener: () => void): () => void;
  /** The latest answer (undefined until the first one); throws the query's error, as useLiveQuery does. */
  getSnapshot(): T | undefined;
};

export function sharedLiveQuery<T>(querier: () => Promise<T>): SharedLiveQuery<T> {
  const listeners = new Set<() => void>();
  let subscription: Subscription | null = null;
  let state: { value: T | undefined; error?: unknown } = { value: undefined };
  const tell = () => listeners.forEach((l) => l());
  return {
    subscribe(listener) {
      listeners.add(listener);
      subscription ??= liveQuery(querier).subscribe({
        next: (value) => {
          state = { value };
          tell();
        },
        error: (error: unknown) => {
          state = { value: undefined, error };
          tell();
        },
      });
      return () => {
        listeners.delete(listener);
        if (listeners.size > 0) return;
        subscription?.unsubscribe();
        subscription = null;
        state = { value: undefined };
      };
    },
    getSnapshot() {
      if (state.error !== undefined) throw state.error;
      return state.value;
    },
  };
}
