import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { contestIdByPublicToken, getResultsData } from "@/db/queries/contest-results";
import { LiveStandings } from "@/components/contests/live-standings";
import { contestStandings } from "@/lib/contests/standings";
import { formatDate } from "@/lib/format";
import { publicTokenSchema } from "@/lib/validations/contest-results";

export const metadata: Metadata = { title: "Results", robots: { index: false } };
export const dynamic = "force-dynamic";

/** A contest's standings through the officer's public link: no account, read-only, refreshed every 20 s; 404 once revoked. */
export default async function PublicResultsPage({ params }: { params: Promise<{ token: string }> }) {
  const parsed = publicTokenSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const contestId = await contestIdByPublicToken(db, parsed.data.token);
  if (!contestId) notFound();
  const data = await getResultsData(db, contestId);
  if (!data) notFound();
  return (
    <main id="main" className="mx-auto max-w-3xl space-y-6 px-4 py-6">
      <header className="space-y-1">
        <p className="text-sm font-bold tracking-tight">Windowcall · results</p>
        <h1 className="text-2xl font-extrabold">{data.contest.name}</h1>
        <p className="text-muted">{formatDate(new Date(`${data.contest.startsOn}T12:00:00Z`))} · {data.contest.fieldName}</p>
      </header>
      <LiveStandings url={`/api/public-results/${parsed.data.token}`} initial={contestStandings(data.input)} />
      <p className="print:hidden"><a className="inline-flex min-h-12 items-center underline" href={`/api/public-results/${parsed.data.token}?format=csv`} download>Results (CSV)</a></p>
    </main>
  );
}
