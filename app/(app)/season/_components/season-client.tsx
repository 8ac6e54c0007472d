"use client";

import { useQuery } from "@tanstack/react-query";
import dynamic from "next/dynamic";
import { useEffect, useRef } from "react";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { seasonFiltersQuery, seasonFiltersSchema, type SeasonFilters } from "@/lib/validations/season";
import { SeasonExports } from "./season-exports";
import { SeasonFilterBar } from "./season-filters";
import { SeasonHeadline } from "./season-headline";
import { summaryQuery } from "./season-queries";
import { SeasonRunsTable } from "./runs-table";
import { SeasonFlightsTable } from "./flights-table";
import { DataAge } from "./data-age";

// the drawing library loads apart from the page's first JavaScript (bench/season.bench.ts measures it)
const SeasonCharts = dynamic(() => import("./season-charts"), { ssr: false, loading: () => <p aria-busy="true">Drawing the charts…</p> });

const NO_FILTERS: SeasonFilters = { kind: "all" };

/**
 * A pilot's season: filters (kept in the address), headline, charts, the runs and flights tables
 * and the exports. `own` when the viewer is the pilot (offers "all my data").
 */
export function SeasonClient({ pilotId, own, pilotName }: { pilotId: string; own: boolean; pilotName?: string }) {
  const params = useSearchParams();
  const router = useRouter();
  const path = usePathname();
  const parsed = seasonFiltersSchema.safeParse(Object.fromEntries(params.entries()));
  const filters = parsed.success ? parsed.data : NO_FILTERS;
  const filterQuery = seasonFiltersQuery(filters);
  const summary = useQuery(summaryQuery(pilotId, filterQuery));
  // The filters last asked for: two quick changes (From, then To) must both land, though the
  // address (and so `filters`) catches up only after each replace. An address we did not ask for
  // (back, forward, a link) resets them.
  const latest = useRef({ filters, asked: new Set<string>(), seen: filterQuery });
  useEffect(() => {
    const mine = latest.current;
    if (mine.seen === filterQuery) return;
    mine.seen = filterQuery;
    if (!mine.asked.has(filterQuery)) mine.filters = filters;
    if (seasonFiltersQuery(mine.filters) === filterQuery) mine.asked.clear();
  }, [filters, filterQuery]);
  const setFilters = (next: SeasonFilters) => {
    const q = seasonFiltersQuery(next);
    latest.current.filters = next;
    latest.current.asked.add(q);
    // a coach's view keeps the pilot in the address (/season?pilot=…)
    const full = own ? q : [`pilot=${pilotId}`, q].filter(Boolean).join("&");
    router.replace(full ? `${path}?${full}` : path, { scroll: false });
  };

  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">{own ? "Season" : `Season of ${pilotName ?? "a pilot"}`}</h1>
      <SeasonFilterBar
        filters={filters} fields={summary.data?.fields ?? []} models={summary.data?.models ?? []}
        onChange={(patch) => setFilters({ ...latest.current.filters, ...patch })} onClear={() => setFilters(NO_FILTERS)}
      />
      {!parsed.success ? <p role="alert">Some filters in the address could not be read; showing the whole season.</p> : null}
      <DataAge query={summary} what="season" />
      {summary.data ? (
        <>
          <SeasonHeadline summary={summary.data} />
          <SeasonCharts summary={summary.data} />
        </>
      ) : summary.isPending ? (
        <p aria-busy="true">Reading the season…</p>
      ) : null}
      <SeasonRunsTable key={`runs-${filterQuery}`} pilotId={pilotId} filters={filterQuery} />
      <SeasonFlightsTable key={`flights-${filterQuery}`} pilotId={pilotId} filters={filterQuery} />
      <SeasonExports pilotId={pilotId} filters={filterQuery} own={own} />
    </div>
  );
}
