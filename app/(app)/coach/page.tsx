import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { acceptEmailOffers } from "@/db/queries/coach/grants";
import { plansOfCoach } from "@/db/queries/coach/plans";
import { getRoster } from "@/db/queries/coach/roster";
import { QueryProvider } from "@/components/query/query-provider";
import { getSessionUser } from "@/lib/auth/session";
import { makeQueryClient } from "@/lib/query/query-client";
import { coachKeys } from "./_components/coach-keys";
import { CoachDesk } from "./_components/coach-desk";

export const metadata: Metadata = { title: "Coach desk" };
export const dynamic = "force-dynamic";

/**
 * The coach's roster of granting pilots and their plans, read on the server and handed to the
 * client's query cache (the first paint has them; later reads go through /api/coach/pilots and
 * /api/coach/plans), and the box for a pilot's one-time code. As with the Season, the service
 * worker keeps the last copy of this page: offline it shows the data it was served with, and
 * says how old it is (DataAge).
 */
export default async function CoachPage() {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in?next=/coach");
  const queryClient = makeQueryClient();
  // as /api/coach/pilots does: an offer made to the coach's verified address is taken up first
  await acceptEmailOffers(db, user);
  await Promise.all([
    queryClient.prefetchQuery({ queryKey: coachKeys.roster, queryFn: async () => ({ pilots: await getRoster(db, user.id) }) }),
    queryClient.prefetchQuery({ queryKey: coachKeys.plans, queryFn: async () => ({ plans: await plansOfCoach(db, user.id) }) }),
  ]);
  return (
    <QueryProvider>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <CoachDesk />
      </HydrationBoundary>
    </QueryProvider>
  );
}
