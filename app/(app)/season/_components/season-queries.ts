import { keepPreviousData, queryOptions } from "@tanstack/react-query";
import type { SeasonFlightRow, SeasonPage, SeasonRunRow, SeasonSummary } from "@/lib/season/types";

/**
 * The Season screen's queries: one key per pilot, part and filter string (the address's filters
 * in a fixed order, lib/validations/season.ts seasonFiltersQuery), so each filter has its own
 * cached answer and the server's prefetch hydrates exactly the key the page asks for.
 */
export const seasonKeys = {
  all: (pilotId: string) => ["season", pilotId] as const,
  summary: (pilotId: string, filters: string) => ["season", pilotId, "summary", filters] as const,
  runs: (pilotId: string, query: string) => ["season", pilotId, "runs", query] as const,
  flights: (pilotId: string, query: string) => ["season", pilotId, "flights", query] as const,
};

/** A failed request, with its status (lib/query retries neither 401 nor 403). */
export class SeasonRequestError extends Error {
  constructor(readonly status: number, message: string) {
    super(message);
  }
}

async function getJson<T>(url: string): Promise<T> {
  const res = await fetch(url, { cache: "no-store", headers: { accept: "application/json" } });
  if (!res.ok) {
    const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new SeasonRequestError(res.status, body?.error?.message ?? `The server answered ${res.status}.`);
  }
  return (await res.json()) as T;
}

export const seasonBase = (pilotId: string) => `/api/pilots/${encodeURIComponent(pilotId)}/season`;
const withQuery = (path: string, query: string) => (query ? `${path}?${query}` : path);

export const summaryQuery = (pilotId: string, filters: string) =>
  queryOptions({
    queryKey: seasonKeys.summary(pilotId, filters),
    queryFn: () => getJson<SeasonSummary>(withQuery(seasonBase(pilotId), filters)),
    placeholderData: keepPreviousData,
  });

export const runsQuery = (pilotId: string, query: string) =>
  queryOptions({
    queryKey: seasonKeys.runs(pilotId, query),
    queryFn: () => getJson<SeasonPage<SeasonRunRow>>(withQuery(`${seasonBase(pilotId)}/runs`, query)),
    placeholderData: keepPreviousData,
  });

export const flightsQuery = (pilotId: string, query: string) =>
  queryOptions({
    queryKey: seasonKeys.flights(pilotId, query),
    queryFn: () => getJson<SeasonPage<SeasonFlightRow>>(withQuery(`${seasonBase(pilotId)}/flights`, query)),
    placeholderData: keepPreviousData,
  });

/** The CSV download's address for these filters. */
export const exportHref = (pilotId: string, what: "runs" | "flights", filters: string) =>
  `${seasonBase(pilotId)}/export?${filters ? `${filters}&` : ""}what=${what}`;
