"use client";

/**
 * Tells the sync layer that a local write is waiting, so it pushes soon (debounced,
 * single-flight, SYNC.md §2). A no-op until the sync provider is mounted.
 */
export function useNotifyWrite(): () => void {
  return () => {};
}
