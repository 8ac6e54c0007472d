import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { getRound } from "@/db/queries/contest-results";
import { listRoundTimekeepers, listTimekeeperCandidates } from "@/db/queries/contest-timekeepers";
import { getContest } from "@/db/queries/contests";
import { MAX_PILOTS_PER_TIMEKEEPER } from "@/lib/contests/timekeepers";
import { roundKey, roundName } from "@/lib/contests/round-key";
import { roundParamsSchema } from "@/lib/validations/contest-results";
import { contestPageAccess } from "../../../_components/guard";
import { GroupTimekeepersForm } from "./_components/group-timekeepers-form";

export const metadata: Metadata = { title: "Round" };
export const dynamic = "force-dynamic";

/** The officer's page of a round: its groups and each pilot's timekeeper, whose phone then times the pilot's lane. */
export default async function RoundPage({ params }: { params: Promise<{ contestId: string; roundNumber: string }> }) {
  const parsed = roundParamsSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const { contestId, roundNumber, flyOff, roundKey: key } = parsed.data;
  const name = roundName({ number: roundNumber, flyOff });
  await contestPageAccess({ contestId, role: "officer", back: `/contests/${contestId}/rounds/${key}` });
  const [found, round] = await Promise.all([getContest(db, contestId), getRound(db, { contestId, roundNumber, flyOff })]);
  if (!found || !round) notFound();
  const [slots, candidates] = await Promise.all([listRoundTimekeepers(db, round.id), listTimekeeperCandidates(db, contestId)]);
  const groups = [...new Set(slots.map((s) => s.groupNumber))];
  const others = [...found.rounds.map((r) => ({ number: r.number, flyOff: false })), ...found.flyOffRounds.map((r) => ({ number: r.number, flyOff: true }))]
    .filter((r) => r.number !== roundNumber || r.flyOff !== flyOff);
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <p><Link className="underline" href={`/contests/${contestId}`}>{found.contest.name}</Link> · <Link className="underline" href={`/contests/${contestId}/rounds/${key}/cards`}>Paper cards</Link> · <Link className="underline" href={`/contests/${contestId}/results`}>Results</Link></p>
        <h1 className="text-2xl font-extrabold">{name}: timekeepers</h1>
        <p>Task {round.task.letter}: {round.task.name}</p>
        <p className="text-sm text-muted">
          Give each pilot a timekeeper: a club member or an entered pilot who does not fly in that group, at most {MAX_PILOTS_PER_TIMEKEEPER} pilots
          each (a phone times four lanes). After their next sync, the timekeeper&apos;s Field screen offers the group&apos;s lanes, offline too; the run they time
          becomes the pilots&apos; official result when it syncs back. Timekeepers follow the field&apos;s safety rules and the contest director&apos;s briefing.
        </p>
      </header>
      {groups.length === 0 && <p className="text-muted">{flyOff ? "The fly-off is not drawn yet: draw it on the contest's page once every preliminary round is scored." : "No draw for this round yet."}</p>}
      {groups.map((g) => (
        <GroupTimekeepersForm
          key={g}
          contestId={contestId}
          roundKey={key}
          groupNumber={g}
          candidates={candidates}
          pilots={slots.filter((s) => s.groupNumber === g).map((s) => ({ ...s, assignedAt: s.assignedAt?.toISOString() ?? null }))}
        />
      ))}
      {others.length > 0 && (
        <nav aria-label="Other rounds" className="flex flex-wrap gap-3">
          {others.map((r) => <Link key={roundKey(r)} className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/rounds/${roundKey(r)}`}>{roundName(r)}</Link>)}
        </nav>
      )}
    </div>
  );
}
