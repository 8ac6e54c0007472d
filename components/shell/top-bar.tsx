import Link from "next/link";
import type { ReactNode } from "react";
import { SyncStatus } from "@/components/sync/sync-status";
import { SETTINGS_ICON } from "./nav-items";

/** The slim top bar: the name (home) on the left; sync status and the Settings gear on the right. No prefetch (bottom-nav.tsx says why). */
export function TopBar({ right }: { right?: ReactNode }) {
  return (
    <header className="sticky top-0 z-20 border-b-2 print:hidden border-line bg-raised pt-[env(safe-area-inset-top)]">
      <div className="mx-auto flex h-14 max-w-xl items-center justify-between px-4">
        <Link href="/" prefetch={false} className="text-lg font-extrabold tracking-tight">
          Windowcall
        </Link>
        <div className="flex items-center gap-3 text-sm">
          <SyncStatus />
          {right}
          <Link href="/settings" prefetch={false} className="-mr-2 flex h-12 w-12 items-center justify-center rounded-lg text-ink">
            <svg aria-hidden viewBox="0 0 24 24" className="h-6 w-6" fill="none" stroke="currentColor" strokeWidth={2} strokeLinecap="round" strokeLinejoin="round">
              <path d={SETTINGS_ICON} />
            </svg>
            <span className="sr-only">Settings</span>
          </Link>
        </div>
      </div>
    </header>
  );
}
