import type { ReactNode } from "react";

/** A bordered panel; thicker borders in the outdoor scheme (globals.css). */
export function Card({ children, className = "" }: { children: ReactNode; className?: string }) {
  return <div className={`card rounded-xl border border-line bg-raised p-4 ${className}`}>{children}</div>;
}
