"use client";

import type { UseQueryResult } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { useOnline } from "@/components/sync/use-online";

/** "5 minutes ago" for an age in milliseconds. */
export function describeAge(ms: number): string {
  const minutes = Math.round(ms / 60_000);
  if (minutes < 1) return "less than a minute ago";
  if (minutes < 60) return `${minutes} minute${minutes === 1 ? "" : "s"} ago`;
  const hours = Math.round(minutes / 60);
  if (hours < 48) return `${hours} hour${hours === 1 ? "" : "s"} ago`;
  return `${Math.round(hours / 24)} days ago`;
}

/**
 * Offline, or when the last request failed: says the figures shown are the last ones fetched,
 * and how old they are (the query's dataUpdatedAt — kept in a page served from the cache too,
 * since the server's prefetch carries its time). Says nothing while fresh data arrives.
 */
export function DataAge({ query, what }: { query: Pick<UseQueryResult, "data" | "dataUpdatedAt" | "isError" | "error">; what: string }) {
  const online = useOnline();
  // the banner never shows in the server's render (online there), so reading the clock here cannot mismatch
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 30_000);
    return () => clearInterval(timer);
  }, []);
  if (online && !query.isError) return null;
  if (!query.data) {
    return <p role="status">{online ? `The ${what} could not be read: ${query.error?.message ?? "no answer"}.` : `Offline — no ${what} fetched on this phone yet.`}</p>;
  }
  const age = `, from ${describeAge(Math.max(0, now - query.dataUpdatedAt))}`;
  return (
    <p role="status" className="rounded-lg border-2 border-line p-2 font-semibold">
      {online ? "Could not refresh" : "Offline"} — showing the last {what} fetched{age}.
    </p>
  );
}
