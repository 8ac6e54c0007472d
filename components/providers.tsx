"use client";

import { QueryClientProvider } from "@tanstack/react-query";
import { SessionProvider } from "next-auth/react";
import type { ReactNode } from "react";
import { SyncProvider } from "@/components/sync/sync-provider";
import { getQueryClient } from "@/lib/query/query-client";

/** Client-side providers for the whole app. */
export function Providers({ children }: { children: ReactNode }) {
  return (
    <SessionProvider refetchOnWindowFocus={false}>
      <QueryClientProvider client={getQueryClient()}>
        <SyncProvider>{children}</SyncProvider>
      </QueryClientProvider>
    </SessionProvider>
  );
}
