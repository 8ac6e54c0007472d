import type { ReactNode } from "react";

/**
 * A box that scrolls sideways on a narrow phone (a wide table). It takes the keyboard's focus and
 * names itself, so a keyboard user can scroll it too (WCAG 2.1.1; axe's `scrollable-region-focusable`).
 */
export function ScrollRegion({ label, className = "", children }: { label: string; className?: string; children: ReactNode }) {
  return (
    <div className={`overflow-x-auto ${className}`.trim()} role="region" aria-label={label} tabIndex={0}>
      {children}
    </div>
  );
}
