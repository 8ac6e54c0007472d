"use client";

import { useQuery } from "@tanstack/react-query";
import type { PaginationState, SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useState } from "react";
import type { SeasonFlightRow } from "@/lib/season/types";
import { flightsQuery } from "./season-queries";
import { dayText, secondsText, taskText } from "./season-format";
import { SeasonTable, tableQuery, type SeasonColumns } from "./season-table";

const columns: SeasonColumns<SeasonFlightRow> = [
  { id: "date", header: "Date", accessorKey: "at", cell: ({ row }) => <Link href={`/logbook/run?id=${row.original.runId}`} className="font-semibold underline" onClick={(e) => e.stopPropagation()}>{dayText(row.original.at)}</Link> },
  { id: "task", header: "Task", accessorKey: "task", cell: ({ row }) => taskText(row.original.task) },
  { id: "flight", header: "Flight", accessorKey: "flight", enableSorting: false },
  { id: "duration", header: "Time", accessorKey: "durationTenths", cell: ({ row }) => secondsText(row.original.durationTenths) },
  { id: "credited", header: "Counted", accessorKey: "creditedTenths", cell: ({ row }) => secondsText(row.original.creditedTenths) },
  { id: "turnaround", header: "Turnaround", accessorKey: "turnaroundTenths", cell: ({ row }) => secondsText(row.original.turnaroundTenths) },
];

/** The flights of the pilot's runs within the filters, sorted and paged on the server; a row opens its run. */
export function SeasonFlightsTable({ pilotId, filters }: { pilotId: string; filters: string }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "date", desc: true }]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: 10 });
  const query = useQuery(flightsQuery(pilotId, tableQuery(filters, sorting, pagination)));
  return (
    <SeasonTable
      id="season-flights" title="Flights" noun="flights" columns={columns} query={query}
      sorting={sorting} onSortingChange={(s) => { setSorting(s); setPagination((p) => ({ ...p, pageIndex: 0 })); }}
      pagination={pagination} onPaginationChange={setPagination}
    />
  );
}
