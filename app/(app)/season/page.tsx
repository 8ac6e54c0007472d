import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { canReadSeason } from "@/db/queries/season/access";
import { db } from "@/db";
import { getSeasonSummary } from "@/db/queries/season/summary";
import { getUserById } from "@/db/queries/users";
import { QueryProvider } from "@/components/query/query-provider";
import { getSessionUser } from "@/lib/auth/session";
import { makeQueryClient } from "@/lib/query/query-client";
import { seasonFiltersQuery, seasonFiltersSchema, seasonParamsSchema } from "@/lib/validations/season";
import { SeasonClient } from "./_components/season-client";
import { seasonKeys } from "./_components/season-queries";

export const metadata: Metadata = { title: "Season" };
export const dynamic = "force-dynamic";

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

/**
 * The signed-in pilot's season. The summary (headline and charts) is read on the server for the
 * address's filters and handed to the client's query cache, so the first paint has it; the tables
 * and every later filter are fetched through the season routes. The coach desk opens the same
 * client for a granting pilot: /season?pilot=<id>, a 404 for anyone canReadSeason refuses
 * (a revoked grant included, from the moment it is revoked).
 */
export default async function SeasonPage({ searchParams }: Props) {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in?next=/season");
  const raw = Object.fromEntries(Object.entries(await searchParams).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));
  const pilotId = raw.pilot && raw.pilot !== user.id ? raw.pilot : user.id;
  const own = pilotId === user.id;
  let pilotName = user.name;
  if (!own) {
    if (!seasonParamsSchema.safeParse({ pilotId }).success || !(await canReadSeason(db, { viewerId: user.id, pilotId }))) notFound();
    pilotName = (await getUserById(db, pilotId))?.name ?? "a pilot";
  }
  const parsed = seasonFiltersSchema.safeParse(raw);
  const queryClient = makeQueryClient();
  if (parsed.success) {
    const filters = parsed.data;
    await queryClient.prefetchQuery({
      queryKey: seasonKeys.summary(pilotId, seasonFiltersQuery(filters)),
      queryFn: () => getSeasonSummary(db, { pilotId, filters, now: new Date() }),
    });
  }
  return (
    <QueryProvider>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <SeasonClient pilotId={pilotId} own={own} pilotName={pilotName} />
      </HydrationBoundary>
    </QueryProvider>
  );
}
