import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { QueryProvider } from "@/components/query/query-provider";
import { getSessionUser } from "@/lib/auth/session";
import { CoachDesk } from "./_components/coach-desk";

export const metadata: Metadata = { title: "Coach desk" };
export const dynamic = "force-dynamic";

/** The coach's roster of granting pilots, fetched through /api/coach/pilots, and the box for a pilot's one-time code. */
export default async function CoachPage() {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in?next=/coach");
  return (
    <QueryProvider>
      <CoachDesk />
    </QueryProvider>
  );
}
