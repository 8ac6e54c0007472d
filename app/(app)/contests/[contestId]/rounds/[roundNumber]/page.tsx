import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { listRoundDisputes } from "@/db/queries/contest-disputes";
import { listContestPenalties } from "@/db/queries/contest-penalties";
import { listPendingRecords, type RecordRunFlight } from "@/db/queries/contest-records";
import { listRoundReflights } from "@/db/queries/contest-reflights";
import { listRoundReflightRequests } from "@/db/queries/contest-reflight-requests";
import { listLinkableLanes } from "@/db/queries/contest-lanes";
import { getRound } from "@/db/queries/contest-results";
import { listRoundTimekeepers, listTimekeeperCandidates } from "@/db/queries/contest-timekeepers";
import { contestTimeZone, getContest } from "@/db/queries/contests";
import { paperCardResult } from "@/lib/contests/paper-card";
import { MAX_PILOTS_PER_TIMEKEEPER } from "@/lib/contests/timekeepers";
import type { TaskDefinition } from "@/lib/tasks";
import { roundKey, roundName } from "@/lib/contests/round-key";
import { formatClock } from "@/lib/format";
import { roundParamsSchema } from "@/lib/validations/contest-results";
import { contestPageAccess } from "../../../_components/guard";
import { GroupTimekeepersForm } from "./_components/group-timekeepers-form";
import { Disputes } from "./_components/disputes";
import { Penalties } from "./_components/penalties";
import { Records, type RecordView } from "./_components/records";
import { Reflights } from "./_components/reflights";
import { ReflightRequests } from "./_components/reflight-requests";

export const metadata: Metadata = { title: "Round" };
export const dynamic = "force-dynamic";

/** The officer's page of a round: its groups and each pilot's timekeeper, whose phone then times the pilot's lane; the round's re-flights, penalties and disputes. */
export default async function RoundPage({ params }: { params: Promise<{ contestId: string; roundNumber: string }> }) {
  const parsed = roundParamsSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const { contestId, roundNumber, flyOff, roundKey: key } = parsed.data;
  const name = roundName({ number: roundNumber, flyOff });
  await contestPageAccess({ contestId, role: "officer", back: `/contests/${contestId}/rounds/${key}` });
  const [found, round, zone] = await Promise.all([getContest(db, contestId), getRound(db, { contestId, roundNumber, flyOff }), contestTimeZone(db, contestId)]);
  if (!found || !round) notFound();
  const [slots, candidates, reflights, pending, lanes, disputes, requests, penalties] = await Promise.all([
    listRoundTimekeepers(db, round.id), listTimekeeperCandidates(db, contestId), listRoundReflights(db, round.id), listPendingRecords(db, round.id),
    listLinkableLanes(db, { clubId: found.contest.clubId, day: found.contest.startsOn, letter: round.task.letter }), listRoundDisputes(db, round.id),
    listRoundReflightRequests(db, round.id), listContestPenalties(db, contestId, round.id),
  ]);
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
      {groups.length > 0 && (
        <Records
          contestId={contestId}
          roundKey={key}
          rows={pending.map((p) => ({ entryId: p.entryId, name: p.name, groupNumber: p.groupNumber, reflight: p.reflight, current: recordView(round.task, zone, null, p), others: p.others.map((o) => recordView(round.task, zone, o.id, o)) }))}
        />
      )}
      <ReflightRequests
        contestId={contestId}
        roundKey={key}
        timeZone={zone}
        groupOf={Object.fromEntries(slots.map((s) => [s.entryId, s.groupNumber]))}
        requests={requests.map((r) => ({ ...r, askedAt: r.askedAt.toISOString(), decidedAt: r.decidedAt?.toISOString() ?? null }))}
      />
      {groups.length > 0 && (
        <Reflights
          contestId={contestId}
          roundKey={key}
          timeZone={zone}
          task={round.task}
          groups={groups}
          lanes={lanes}
          pilots={slots.map((s) => ({ entryId: s.entryId, name: s.name, groupNumber: s.groupNumber }))}
          candidates={candidates}
          flyingByGroup={flyingByGroup(slots, reflights)}
          reflights={reflights.map((r) => ({
            ...r, grantedAt: r.grantedAt.toISOString(), recordedAt: r.recordedAt?.toISOString() ?? null, signed: r.signedAt !== null, runResultTenths: r.runResultTenths ?? null,
            timekeeperAssignedAt: r.timekeeperAssignedAt?.toISOString() ?? null,
          }))}
        />
      )}
      {groups.length > 0 && (
        <Penalties
          contestId={contestId}
          roundKey={key}
          timeZone={zone}
          pilots={slots.map((s) => ({ entryId: s.entryId, name: s.name, groupNumber: s.groupNumber }))}
          penalties={penalties}
        />
      )}
      {groups.length > 0 && (
        <Disputes
          contestId={contestId}
          roundKey={key}
          timeZone={zone}
          pilots={slots.map((s) => ({ entryId: s.entryId, name: s.name, groupNumber: s.groupNumber }))}
          disputes={disputes.map((d) => ({ ...d, lodgedAt: d.lodgedAt.toISOString(), recordedAt: d.recordedAt.toISOString(), resolvedAt: d.resolvedAt?.toISOString() ?? null }))}
        />
      )}
      {others.length > 0 && (
        <nav aria-label="Other rounds" className="flex flex-wrap gap-3">
          {others.map((r) => <Link key={roundKey(r)} className="inline-flex min-h-12 items-center underline" href={`/contests/${contestId}/rounds/${roundKey(r)}`}>{roundName(r)}</Link>)}
        </nav>
      )}
    </div>
  );
}

/** Each group's flying accounts: its drawn pilots and the pilots re-flying in it (a re-flight's timekeeper is none of them). */
function flyingByGroup(slots: { entryId: string; groupNumber: number; pilotUserId: string | null }[], reflights: { entryId: string; groupNumber: number }[]): Record<number, string[]> {
  const user = new Map(slots.map((s) => [s.entryId, s.pilotUserId]));
  const out: Record<number, string[]> = {};
  for (const x of [...slots, ...reflights]) {
    const id = user.get(x.entryId);
    if (id) (out[x.groupNumber] ??= []).push(id);
  }
  return out;
}

/** The run's flights in flown order (seconds; a flight the task does not count marked with its status, lib/tasks FlightStatus). */
const runFlightsText = (flights: RecordRunFlight[] | null) =>
  flights && flights.length > 0 ? `: ${flights.map((f) => `${(f.timeTenths / 10).toFixed(1)}${f.status === "counted" ? "" : ` (${f.status.replace("-", " ")})`}`).join(" ")}` : "";

const stamp = (d: Date | null, zone: string) => (d ? formatClock(d, zone, "short") : "");

/** One record as the officer compares it: what it is, its result (a paper card through the task engine, a run's server result), who recorded it, its signature. */
function recordView(task: TaskDefinition, zone: string, id: string | null, r: {
  paperFlights: number[] | null; runId: string | null; lane: number | null; runResultTenths: number | null; runFlights: RecordRunFlight[] | null; recordedAt: Date | null; recordedBy: string | null; signedAt: Date | null; signedFrom: string | null;
}): RecordView {
  const paper = r.paperFlights !== null;
  return {
    id,
    what: paper ? `Paper card: ${r.paperFlights!.map((t) => (t / 10).toFixed(1)).join(" ")}` : r.runId ? `Timed run, lane ${(r.lane ?? 0) + 1}${runFlightsText(r.runFlights)}` : "Nothing recorded",
    resultTenths: paper ? paperCardResult(task, r.paperFlights!).tenths : r.runResultTenths,
    recorded: `recorded by ${r.recordedBy ?? "someone"} ${stamp(r.recordedAt, zone)}`.trim(),
    signed: r.signedAt ? `signed ${stamp(r.signedAt, zone)}${r.signedFrom ? `, ${r.signedFrom}` : ""}` : "not signed",
  };
}
