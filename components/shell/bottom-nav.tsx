"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { NAV_ITEMS } from "./nav-items";

/**
 * Thumb-reach navigation: the main screens, each a 64 px target, the current one marked by a bar and bold text.
 * No prefetch: Next would fetch and decode all six screens while the page loads, on a weak signal, on the
 * main thread of every signed-in page (issue #10); a tap fetches its screen, and the pages the field needs
 * offline are precached by the service worker anyway.
 */
export function BottomNav() {
  const path = usePathname();
  return (
    <nav aria-label="Main" className="print:hidden fixed inset-x-0 bottom-0 z-20 border-t-2 border-line bg-raised pb-[env(safe-area-inset-bottom)]">
      <ul className="mx-auto grid max-w-xl" style={{ gridTemplateColumns: `repeat(${NAV_ITEMS.length}, minmax(0, 1fr))` }}>
        {NAV_ITEMS.map((item) => {
          const current = item.href === "/" ? path === "/" : path === item.href || path.startsWith(item.href + "/");
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                prefetch={false}
                aria-current={current ? "page" : undefined}
                className={`flex min-h-touch flex-col items-center justify-center gap-0.5 text-xs ${
                  current ? "font-bold text-ink" : "text-muted"
                }`}
              >
                <svg aria-hidden viewBox="0 0 24 24" className="h-6 w-6" fill="none" stroke="currentColor" strokeWidth={current ? 2.6 : 1.8} strokeLinecap="round" strokeLinejoin="round">
                  <path d={item.icon} />
                </svg>
                <span className={current ? "border-b-2 border-ink" : ""}>{item.label}</span>
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
