"use client";

import { useSync } from "@/components/sync/sync-provider";

/**
 * Tells the sync client that a local write is waiting, so it pushes soon (debounced,
 * single-flight, SYNC.md §2). Called only after the write is stored. Before the client has
 * loaded there is nothing to tell: it flushes the outbox when it starts.
 */
export function useNotifyWrite(): () => void {
  const { client } = useSync();
  return () => client?.notifyWrite();
}
