"use client";

import { useSync } from "@/components/sync/sync-provider";

/**
 * Tells the sync client that a local write is waiting, so it pushes soon (debounced,
 * single-flight, SYNC.md §2). Called only after the write is stored. Before the client has
 * loaded (it loads once the page has settled) this loads it now: it flushes the outbox when it starts.
 */
export function useNotifyWrite(): () => void {
  const { client, wake } = useSync();
  return () => (client ? client.notifyWrite() : wake());
}
