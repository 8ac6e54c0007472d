"use client";
import { useQuery } from "@tanstack/react-query";
import { QueryProvider } from "@/components/query/query-provider";
import type { Standings } from "@/lib/contests/standings";
import { StandingsTable } from "./standings-table";

type Reply = { standings: Standings };

/** The standings, read again from `url` (a results route) every 20 s while the page is open: new cards and synced runs show up. */
export function LiveStandings(props: { url: string; initial: Standings }) {
  return (
    <QueryProvider>
      <Refreshed {...props} />
    </QueryProvider>
  );
}

function Refreshed({ url, initial }: { url: string; initial: Standings }) {
  const { data, isError } = useQuery({
    queryKey: ["contest-standings", url],
    queryFn: async (): Promise<Reply> => {
      const res = await fetch(url, { headers: { accept: "application/json" } });
      if (!res.ok) throw new Error(`Results: ${res.status}`);
      return (await res.json()) as Reply;
    },
    initialData: { standings: initial },
    refetchInterval: 20_000,
  });
  return (
    <div>
      {isError && <p role="status" className="text-sm text-warn print:hidden">Could not refresh; showing the last standings read.</p>}
      <StandingsTable standings={data.standings} />
    </div>
  );
}
