"use client";

import type { UseQueryResult } from "@tanstack/react-query";
import { rowPaginationFeature, rowSortingFeature, tableFeatures, useTable, type ColumnDef, type PaginationState, type RowData, type SortingState } from "@tanstack/react-table";
import { useRouter } from "next/navigation";
import type { SeasonPage } from "@/lib/season/types";
import { PAGE_SIZES } from "@/lib/validations/season";
import { DataAge } from "./data-age";
import { ScrollRegion } from "@/components/ui/scroll-region";

export const seasonTableFeatures = tableFeatures({ rowSortingFeature, rowPaginationFeature });
export type SeasonColumns<Row extends RowData> = ColumnDef<typeof seasonTableFeatures, Row>[];

type Props<Row extends RowData & { runId: string }> = {
  id: string;
  title: string;
  noun: string;
  columns: SeasonColumns<Row>;
  query: UseQueryResult<SeasonPage<Row>>;
  sorting: SortingState;
  onSortingChange: (s: SortingState) => void;
  pagination: PaginationState;
  onPaginationChange: (p: PaginationState) => void;
};

const EMPTY: never[] = [];
const button = "min-h-12 rounded-lg border-2 border-line px-3 font-semibold disabled:opacity-50";

/**
 * A table of the season sorted and paged on the server (TanStack Table in manual mode: the
 * query's rows are the page). A header button sorts by its column; a row opens its run.
 */
export function SeasonTable<Row extends RowData & { runId: string }>(props: Props<Row>) {
  const { id, title, noun, columns, query, sorting, pagination } = props;
  const router = useRouter();
  const table = useTable({
    features: seasonTableFeatures,
    columns,
    data: query.data?.rows ?? EMPTY,
    rowCount: query.data?.total ?? 0,
    state: { sorting, pagination },
    onSortingChange: (u) => props.onSortingChange(typeof u === "function" ? u(sorting) : u),
    onPaginationChange: (u) => props.onPaginationChange(typeof u === "function" ? u(pagination) : u),
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
  });
  const total = query.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pagination.pageSize));
  return (
    <section aria-labelledby={`${id}-title`} className="space-y-2">
      <h2 id={`${id}-title`} className="text-lg font-bold">{title}</h2>
      <DataAge query={query} what={noun} />
      <ScrollRegion label={title}>
        <table id={id} className="figures w-full text-left text-sm" aria-busy={query.isFetching}>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} scope="col" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                      {header.column.getCanSort() ? (
                        <button type="button" onClick={header.column.getToggleSortingHandler()} className="min-h-12 text-left font-bold underline">
                          <table.FlexRender header={header} />
                          {sorted ? <span aria-hidden="true">{sorted === "asc" ? " ▲" : " ▼"}</span> : null}
                        </button>
                      ) : (
                        <table.FlexRender header={header} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="cursor-pointer border-t border-line hover:bg-surface" onClick={() => router.push(`/logbook/run?id=${row.original.runId}`)}>
                {row.getAllCells().map((cell) => <td key={cell.id} className="py-2 pr-2"><table.FlexRender cell={cell} /></td>)}
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
      {query.data && total === 0 ? <p className="text-muted">No {noun} within these filters.</p> : null}
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" className={button} onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>Previous</button>
        <span className="figures" aria-live="polite">Page {pagination.pageIndex + 1} of {pages} · {total} {noun}</span>
        <button type="button" className={button} onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>Next</button>
        <label className="ml-auto text-sm font-semibold">
          Per page{" "}
          <select value={pagination.pageSize} onChange={(e) => table.setPageSize(Number(e.target.value))} className="min-h-12 rounded-lg border-2 border-line bg-raised px-2">
            {PAGE_SIZES.map((n) => <option key={n} value={n}>{n}</option>)}
          </select>
        </label>
      </div>
    </section>
  );
}

/** The table's request: the page's filters, then page, size and sort (server names; 1-based page). */
export function tableQuery(filters: string, sorting: SortingState, pagination: PaginationState): string {
  const q = new URLSearchParams(filters);
  const sort = sorting[0];
  if (sort) {
    q.set("sort", sort.id);
    q.set("dir", sort.desc ? "desc" : "asc");
  }
  q.set("page", String(pagination.pageIndex + 1));
  q.set("size", String(pagination.pageSize));
  return q.toString();
}
