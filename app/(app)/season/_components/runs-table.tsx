"use client";

import { useQuery } from "@tanstack/react-query";
import type { PaginationState, SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useState } from "react";
import type { SeasonRunRow } from "@/lib/season/types";
import { runsQuery } from "./season-queries";
import { dayText, secondsText, shareText, taskText } from "./season-format";
import { SeasonTable, tableQuery, type SeasonColumns } from "./season-table";

const columns: SeasonColumns<SeasonRunRow> = [
  { id: "date", header: "Date", accessorKey: "at", cell: ({ row }) => <Link href={`/logbook/run?id=${row.original.runId}`} className="font-semibold underline" onClick={(e) => e.stopPropagation()}>{dayText(row.original.at)}</Link> },
  { id: "task", header: "Task", accessorKey: "task", cell: ({ row }) => taskText(row.original.task) },
  { id: "field", header: "Field", accessorKey: "field" },
  { id: "result", header: "Result", accessorKey: "resultTenths", cell: ({ row }) => secondsText(row.original.resultTenths) },
  { id: "share", header: "Of max", accessorKey: "share", cell: ({ row }) => shareText(row.original.share) },
  { id: "flights", header: "Flights", accessorKey: "flights" },
];

/** The pilot's runs within the filters, sorted and paged on the server; a row opens its run. */
export function SeasonRunsTable({ pilotId, filters }: { pilotId: string; filters: string }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "date", desc: true }]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: 10 });
  const query = useQuery(runsQuery(pilotId, tableQuery(filters, sorting, pagination)));
  return (
    <SeasonTable
      id="season-runs" title="Runs" noun="runs" columns={columns} query={query}
      sorting={sorting} onSortingChange={(s) => { setSorting(s); setPagination((p) => ({ ...p, pageIndex: 0 })); }}
      pagination={pagination} onPaginationChange={setPagination}
    />
  );
}
