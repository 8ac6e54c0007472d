import type { ReactNode } from "react";

/** One section of the Settings page: a region named by its heading (tests and screen readers find it by that name). */
export function SettingsSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-h`} className="space-y-2">
      <h2 id={`${id}-h`} className="text-lg font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}
