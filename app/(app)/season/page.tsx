import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { QueryProvider } from "@/components/query/query-provider";
import { getSessionUser } from "@/lib/auth/session";
import { makeQueryClient } from "@/lib/query/query-client";
import { seasonFiltersQuery, seasonFiltersSchema } from "@/lib/validations/season";
import { SeasonClient } from "./_components/season-client";
import { seasonKeys } from "./_components/season-queries";

export const metadata: Metadata = { title: "Season" };
export const dynamic = "force-dynamic";

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

/**
 * The signed-in pilot's season. The summary (headline and charts) is read on the server for the
 * address's filters and handed to the client's query cache, so the first paint has it; the tables
 * and every later filter are fetched through the season routes. The coach desk opens the same
 * client for a granting pilot (it takes the pilot as a prop).
 */
export default async function SeasonPage({ searchParams }: Props) {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in?next=/season");
  const raw = Object.fromEntries(Object.entries(await searchParams).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));
  const parsed = seasonFiltersSchema.safeParse(raw);
  const queryClient = makeQueryClient();
  if (parsed.success) {
    const filters = parsed.data;
    await queryClient.prefetchQuery({
      queryKey: seasonKeys.summary(user.id, seasonFiltersQuery(filters)),
      queryFn: () => getSeasonSummary(db, { pilotId: user.id, filters, now: new Date() }),
    });
  }
  return (
    <QueryProvider>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <SeasonClient pilotId={user.id} own />
      </HydrationBoundary>
    </QueryProvider>
  );
}
