"use client";

import type { ReactNode } from "react";
import { SessionStateProvider } from "@/components/auth/session-state";
import { SyncProvider } from "@/components/sync/sync-provider";

/**
 * Client-side providers for the whole signed-in app: who is signed in (without next-auth's client
 * library: components/auth/session-state.tsx) and sync (whose heavy half loads
 * after first paint: components/sync/sync-runtime.ts). TanStack Query is not among them: no screen
 * uses it yet, and every signed-in page's first load would carry it (a screen that does wraps
 * itself in QueryClientProvider with lib/query's getQueryClient()).
 */
export function Providers({ children }: { children: ReactNode }) {
  return (
    <SessionStateProvider>
      <SyncProvider>{children}</SyncProvider>
    </SessionStateProvider>
  );
}
