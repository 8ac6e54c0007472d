import type { SyncClient } from "./sync-client";

/**
 * Wire a sync client to the browser (SYNC.md §2: Background Sync is Chromium-only, so we
 * flush ourselves): start now, then on `online` and when the page becomes visible.
 * Writes call `client.notifyWrite()` themselves. Returns a function that unwires.
 */
export function startSyncInBrowser(client: SyncClient, win: Window = window): () => void {
  const onOnline = () => client.onOnline();
  const onVisibility = () => {
    if (win.document.visibilityState === "visible") client.onVisible();
  };
  win.addEventListener("online", onOnline);
  win.document.addEventListener("visibilitychange", onVisibility);
  void client.start();
  return () => {
    win.removeEventListener("online", onOnline);
    win.document.removeEventListener("visibilitychange", onVisibility);
    client.stop();
  };
}
