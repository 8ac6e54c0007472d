import Link from "next/link";
import type { ReactNode } from "react";
import { SyncStatus } from "@/components/sync/sync-status";

/** The slim top bar: the name (home) on the left, status on the right. */
export function TopBar({ right }: { right?: ReactNode }) {
  return (
    <header className="sticky top-0 z-20 border-b-2 border-line bg-raised pt-[env(safe-area-inset-top)]">
      <div className="mx-auto flex h-14 max-w-xl items-center justify-between px-4">
        <Link href="/" className="text-lg font-extrabold tracking-tight">
          Windowcall
        </Link>
        <div className="flex items-center gap-3 text-sm">
          <SyncStatus />
          {right}
        </div>
      </div>
    </header>
  );
}
