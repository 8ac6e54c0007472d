import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { listContestPenalties } from "@/db/queries/contest-penalties";
import { listContestReflights } from "@/db/queries/contest-reflights";
import { getResultsData } from "@/db/queries/contest-results";
import { contestTimeZone } from "@/db/queries/contests";
import { listSignatures } from "@/db/queries/contest-timekeepers";
import { LiveStandings } from "@/components/contests/live-standings";
import { hasClubRole } from "@/lib/clubs/roles";
import { contestStandings } from "@/lib/contests/standings";
import { penaltyCauseText, penaltyNotCounted, penaltyWhoWhen } from "@/lib/contests/penalties";
import { REFLIGHT_CAUSE_WORDS, REFLIGHT_PLACEMENT_WORDS } from "@/lib/field/ruling-words";
import { formatClock, formatDate } from "@/lib/format";
import { contestIdSchema } from "@/lib/validations/contests";
import { contestPageAccess } from "../../_components/guard";
import { PrintButton, PublicLink } from "./_components/results-tools";

export const metadata: Metadata = { title: "Results" };
export const dynamic = "force-dynamic";

/** The live standings for the club's members; the officer publishes a public link. CSV and print for everyone who sees it. */
export default async function ResultsPage({ params }: { params: Promise<{ contestId: string }> }) {
  const parsed = contestIdSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const { contestId } = parsed.data;
  const me = await contestPageAccess({ contestId, role: "member", back: `/contests/${contestId}/results` });
  const [data, signatures, reflights, penalties, zone] = await Promise.all([
    getResultsData(db, contestId), listSignatures(db, contestId), listContestReflights(db, contestId), listContestPenalties(db, contestId), contestTimeZone(db, contestId),
  ]);
  if (!data) notFound();
  const officer = me.role === "admin" || hasClubRole(me.clubRole, "officer");
  const api = `/api/contests/${contestId}/results`;
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <p className="print:hidden"><Link className="underline" href={`/contests/${contestId}`}>{data.contest.name}</Link></p>
        <h1 className="text-2xl font-extrabold">Results: {data.contest.name}</h1>
        <p className="text-muted">{formatDate(new Date(`${data.contest.startsOn}T12:00:00Z`))} · {data.contest.fieldName}</p>
      </header>
      <LiveStandings url={api} initial={contestStandings(data.input)} />
      <details className="rounded-xl border-2 border-line p-3 print:hidden">
        <summary className="min-h-12 cursor-pointer py-3 font-bold">Signatures ({signatures.length})</summary>
        {signatures.length === 0 ? <p className="text-muted">No result signed yet.</p> : (
          <ul aria-label="Signatures" className="space-y-1">
            {signatures.map((s) => (
              <li key={`${s.isFlyOff}:${s.roundNumber}:${s.groupNumber}:${s.name}`}>
                {s.isFlyOff ? "Fly-off round" : "Round"} {s.roundNumber}, group {s.groupNumber}, {s.name}: signed {formatClock(s.signedAt!, zone, "short")}, {s.signedFrom ?? "signed"}
              </li>
            ))}
          </ul>
        )}
      </details>
      <details className="rounded-xl border-2 border-line p-3 print:hidden">
        <summary className="min-h-12 cursor-pointer py-3 font-bold">Re-flights ({reflights.length})</summary>
        {reflights.length === 0 ? <p className="text-muted">No re-flight granted.</p> : (
          <ul aria-label="Re-flights" className="space-y-1">
            {reflights.map((r) => (
              <li key={`${r.isFlyOff}:${r.roundNumber}:${r.name}`}>
                {r.isFlyOff ? "Fly-off round" : "Round"} {r.roundNumber}, {r.name}: {REFLIGHT_CAUSE_WORDS[r.cause]}, {REFLIGHT_PLACEMENT_WORDS[r.placement].label} (group {r.groupNumber}){r.entitled ? "" : ", flying again with the re-flyer"};
                granted by {r.grantedBy ?? "a former officer"} {formatClock(r.grantedAt, zone, "short")}{r.reason ? ` (${r.reason})` : ""}
              </li>
            ))}
          </ul>
        )}
      </details>
      <details className="rounded-xl border-2 border-line p-3 print:hidden">
        <summary className="min-h-12 cursor-pointer py-3 font-bold">Penalties ({penalties.length})</summary>
        {penalties.length === 0 ? <p className="text-muted">No penalty given.</p> : (
          <ul aria-label="Penalties" className="space-y-1">
            {penalties.map((p, i) => (
              <li key={i} className={p.removedAtMs !== null ? "text-muted" : undefined}>
                <span className={p.removedAtMs !== null ? "line-through" : undefined}>
                  {p.isFlyOff ? "Fly-off round" : "Round"} {p.roundNumber}, {p.name}: −{p.points}{p.cause ? `, ${penaltyCauseText(p.cause)}` : ""}{p.reason ? ` "${p.reason}"` : ""}
                </span>
                ; {penaltyWhoWhen(p, zone)}
                {penaltyNotCounted(p) && <span className="font-bold"> — not counted ({penaltyNotCounted(p)})</span>}
              </li>
            ))}
          </ul>
        )}
      </details>
      <section aria-labelledby="downloads" className="space-y-2 print:hidden">
        <h2 id="downloads" className="text-lg font-bold">Print and download</h2>
        <ul className="space-y-2">
          <li><a className="inline-flex min-h-12 items-center underline" href={`${api}?format=pdf`} download>Results (PDF)</a></li>
          <li><a className="inline-flex min-h-12 items-center underline" href={`${api}?format=csv`} download>Results (CSV)</a></li>
          <li><a className="inline-flex min-h-12 items-center underline" href={`${api}?format=flights-csv`} download>Every flight (CSV)</a></li>
          <li><a className="inline-flex min-h-12 items-center underline" href={`${api}?format=penalties-csv`} download>Every penalty (CSV)</a></li>
          <li><Link className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/sheets`}>Group lists and scoresheets</Link></li>
        </ul>
        <PrintButton />
      </section>
      {officer && <PublicLink contestId={contestId} token={data.contest.publicToken} />}
    </div>
  );
}
