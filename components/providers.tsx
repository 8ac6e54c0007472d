"use client";

import { QueryClientProvider } from "@tanstack/react-query";
import { SessionProvider } from "next-auth/react";
import type { ReactNode } from "react";
import { getQueryClient } from "@/lib/query/query-client";

/** Client-side providers for the whole app. */
export function Providers({ children }: { children: ReactNode }) {
  return (
    <SessionProvider refetchOnWindowFocus={false}>
      <QueryClientProvider client={getQueryClient()}>{children}</QueryClientProvider>
    </SessionProvider>
  );
}
