import type { ReactNode } from "react";

/** One part of /admin: a region named by its heading (tests and screen readers find it by that name). */
export function AdminSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-h`} className="space-y-3">
      <h2 id={`${id}-h`} className="text-lg font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** The quiet line a list shows when it has nothing. */
export function Empty({ children }: { children: ReactNode }) {
  return <p className="text-muted">{children}</p>;
}
