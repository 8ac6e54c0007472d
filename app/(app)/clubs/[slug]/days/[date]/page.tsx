import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { QueryProvider } from "@/components/query/query-provider";
import { db } from "@/db";
import { getDayBoard } from "@/db/queries/club-day-board";
import { makeQueryClient } from "@/lib/query/query-client";
import { dayParam } from "@/lib/validations/club-days";
import { clubPageAccess } from "../../_components/access";
import { DayBoardClient } from "./_components/day-board-client";
import { dayBoardKey } from "./_components/day-board-query";

export const metadata: Metadata = { title: "Day board" };
export const dynamic = "force-dynamic";

type Props = { params: Promise<{ slug: string; date: string }> };

/**
 * A club's field day: the Day board. The club role is checked on the server (the club page's
 * guard: a non-member gets the same 404 as for a club that does not exist); the board is
 * aggregated on the server, handed to the client's query cache for the first paint, and read
 * again through GET /api/clubs/[slug]/days/[date].
 */
export default async function DayBoardPage({ params }: Props) {
  const { slug, date } = await params;
  const access = await clubPageAccess(slug);
  const day = dayParam(date);
  if (day === null) notFound();
  const board = await getDayBoard(db, { clubId: access.clubId, day });
  if (!board) notFound();
  const queryClient = makeQueryClient();
  queryClient.setQueryData(dayBoardKey(access.club.slug, day), board);
  return (
    <QueryProvider>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <DayBoardClient slug={access.club.slug} clubName={access.club.name} day={day} canClose={access.clubRole === "officer" || access.role === "admin"} />
      </HydrationBoundary>
    </QueryProvider>
  );
}
