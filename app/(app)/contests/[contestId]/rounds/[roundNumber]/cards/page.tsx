import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { listLinkableLanes } from "@/db/queries/contest-lanes";
import { getRound, listRoundSlots } from "@/db/queries/contest-results";
import { contestTimeZone, getContest } from "@/db/queries/contests";
import { paperCardProblem } from "@/lib/contests/paper-card";
import { roundKey, roundName } from "@/lib/contests/round-key";
import { roundParamsSchema } from "@/lib/validations/contest-results";
import { contestPageAccess } from "../../../../_components/guard";
import { GroupCardsForm } from "./_components/group-cards-form";

export const metadata: Metadata = { title: "Paper cards" };
export const dynamic = "force-dynamic";

/** The officer enters a round's results from the paper scorecards, one group at a time. */
export default async function PaperCardsPage({ params }: { params: Promise<{ contestId: string; roundNumber: string }> }) {
  const parsed = roundParamsSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const { contestId, roundNumber, flyOff, roundKey: key } = parsed.data;
  const name = roundName({ number: roundNumber, flyOff });
  await contestPageAccess({ contestId, role: "officer", back: `/contests/${contestId}/rounds/${key}/cards` });
  const [found, round, zone] = await Promise.all([getContest(db, contestId), getRound(db, { contestId, roundNumber, flyOff }), contestTimeZone(db, contestId)]);
  if (!found || !round) notFound();
  const [slots, lanes] = await Promise.all([
    listRoundSlots(db, round.id),
    listLinkableLanes(db, { clubId: found.contest.clubId, day: found.contest.startsOn, letter: round.task.letter }),
  ]);
  const groups = [...new Set(slots.map((s) => s.groupNumber))];
  const problem = paperCardProblem(round.task);
  const others = [...found.rounds.map((r) => ({ number: r.number, flyOff: false })), ...found.flyOffRounds.map((r) => ({ number: r.number, flyOff: true }))]
    .filter((r) => r.number !== roundNumber || r.flyOff !== flyOff);
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <p><Link className="underline" href={`/contests/${contestId}`}>{found.contest.name}</Link> · <Link className="underline" href={`/contests/${contestId}/results`}>Results</Link></p>
        <h1 className="text-2xl font-extrabold">{name}: paper cards</h1>
        <p>Task {round.task.letter}: {round.task.name}</p>
        <p className="text-sm text-muted">
          Type each pilot&apos;s flight times as on the card, in flown order, separated by spaces (seconds like 83.4, or 1:23.4),
          or choose the run a timekeeper&apos;s phone timed and synced for the pilot (runs of the club&apos;s sessions on the contest day with this task).
          The task&apos;s rules are checked as you type. Tick &quot;Signed&quot; only when pilot and timekeeper signed the card: an unsigned result scores zero (F3K.1.2).
          Penalty points here are the card&apos;s; penalties given on a timekeeper&apos;s phone count on their own through the linked run (do not type them again).
        </p>
      </header>
      {problem && <p role="alert" className="font-bold text-danger">{problem}</p>}
      {groups.length === 0 && <p className="text-muted">{flyOff ? "The fly-off is not drawn yet: draw it on the contest's page once every preliminary round is scored." : "No draw for this round yet."}</p>}
      {!problem && groups.map((g) => (
        <GroupCardsForm
          key={g}
          contestId={contestId}
          roundKey={key}
          groupNumber={g}
          task={round.task}
          lanes={lanes}
          timeZone={zone}
          pilots={slots.filter((s) => s.groupNumber === g).map((s) => ({
            entryId: s.entryId, name: s.name, flights: s.paperFlights, penaltyPoints: s.penaltyPoints,
            signed: s.signedAt !== null, recordedAt: s.recordedAt?.toISOString() ?? null,
            link: s.runId !== null && s.lane !== null ? { runId: s.runId, lane: s.lane, resultTenths: s.runResultTenths } : null,
          }))}
        />
      ))}
      {others.length > 0 && (
        <nav aria-label="Other rounds" className="flex flex-wrap gap-3">
          {others.map((r) => <Link key={roundKey(r)} className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/rounds/${roundKey(r)}/cards`}>{roundName(r)}</Link>)}
        </nav>
      )}
    </div>
  );
}
