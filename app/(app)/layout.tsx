import type { ReactNode } from "react";
import { Providers } from "@/components/providers";
import { BottomNav } from "@/components/shell/bottom-nav";
import { TopBar } from "@/components/shell/top-bar";

/**
 * The signed-in app's frame. It does no auth itself (field pages must open offline, with no
 * server): each page with server data calls requireUser/getSessionUser. The client providers (session,
 * queries, the device database and sync) live here, not in the root layout, so sign-in, sign-up and
 * the offline page load none of them.
 */
export default function AppLayout({ children }: { children: ReactNode }) {
  return (
    <Providers>
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-30 focus:bg-raised focus:p-2">
        Skip to content
      </a>
      <TopBar />
      <main id="main" className="mx-auto max-w-xl px-4 pb-28 pt-4">
        {children}
      </main>
      <BottomNav />
    </Providers>
  );
}
