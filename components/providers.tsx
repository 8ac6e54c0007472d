"use client";

import type { ReactNode } from "react";
import { SyncProvider } from "@/components/sync/sync-provider";

/**
 * Client-side providers for the whole signed-in app: sync, which also follows next-auth's session
 * (loaded after first paint: components/sync/session-watch.tsx). TanStack Query is not among them:
 * no screen uses it yet, and every signed-in page's first load would carry it (a screen that does
 * wraps itself in QueryClientProvider with lib/query's getQueryClient()).
 */
export function Providers({ children }: { children: ReactNode }) {
  return <SyncProvider>{children}</SyncProvider>;
}
